export * from './distance'
export * from './tow-charge'
export * from './tow-reasons'
