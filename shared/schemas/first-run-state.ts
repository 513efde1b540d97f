import { z } from 'zod'

/** GET /api/first-run: whether this install still waits for its first manager (no company yet). Its own file: the sign-in page reads it. */
export const firstRunStateSchema = z.object({ needed: z.boolean() })
export type FirstRunState = z.infer<typeof firstRunStateSchema>
