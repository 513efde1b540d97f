import { z } from 'zod'
import { firstRunChoicesSchema, type FirstRun } from '@shared/schemas/first-run'
import { request } from './http'

/** Makes the company, its first yard and manager; the caller then signs them in with the same password. */
export const submitFirstRun = (input: FirstRun) => request('POST', '/api/first-run', z.object({ user: z.object({ email: z.string() }), yardId: z.uuid() }), input)

/** The samples a first yard may start from and the map to place it on: only while no company exists. */
export const fetchFirstRunChoices = () => request('GET', '/api/first-run/choices', firstRunChoicesSchema)
