/** The live exercise, shared by server and client: types, clock math, visibility rules, folding. */
export * from './types'
export * from './clock'
export * from './visibility'
export * from './headline'
export * from './fold'
export * from './schedule'
