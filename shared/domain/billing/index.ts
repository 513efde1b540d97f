export * from './money'
export * from './bill-lines'
export * from './day-count'
export * from './storage-bill'
