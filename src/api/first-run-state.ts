import { firstRunStateSchema } from '@shared/schemas/first-run-state'
import { request } from './http'

/** Whether this install still waits for its first manager (no company yet); small, as the sign-in page asks it. */
export const fetchFirstRun = () => request('GET', '/api/first-run', firstRunStateSchema)
