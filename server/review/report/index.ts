// The after-action report: its data, the PDF and inject cards, and the mailing.
export * from './data'
export * from './pdf'
export * from './cards'
export * from './send'
export * from './chart'
export * from './layout'
export * from './markdown'
