// Unit tests see every catalog, as a page after sign-in does (src/i18n/index.ts loads past the
// sign-in page's namespaces on demand).
import { loadMessages } from '@/i18n'

await Promise.all([loadMessages('en'), loadMessages('es')])
