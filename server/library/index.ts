// The scenario library and its attachments, the inject list as a spreadsheet, starting exercises from it, and the demo seed.
export * from './scenarios'
export * from './attachments'
export * from './exercises'
export * from './seed'
export * from './msel'
