// The scenario library and its attachments, starting exercises from it, and the demo seed.
export * from './scenarios'
export * from './attachments'
export * from './exercises'
export * from './seed'
