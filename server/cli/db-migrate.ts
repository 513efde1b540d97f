import { withDatabase } from './open'

await withDatabase(async () => console.log('Migrations applied.'))
