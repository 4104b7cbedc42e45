// After action: the review desk, findings and improvement plan, feedback, hotwash notes, exports and PDFs.
export * from './review'
export * from './plan'
export * from './feedback'
export * from './notes'
export * from './exports'
export * from './pdf'
export * from './report'
