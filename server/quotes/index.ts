export { quotesRouter } from './quotes.routes'
