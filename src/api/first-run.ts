import { z } from 'zod'
import type { FirstRun } from '@shared/schemas/first-run'
import { request } from './http'

/** Makes the company, its first yard and manager; the caller then signs them in with the same password. */
export const submitFirstRun = (input: FirstRun) => request('POST', '/api/first-run', z.object({ user: z.object({ email: z.string() }), yardId: z.uuid() }), input)
