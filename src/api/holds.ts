import { z } from 'zod'
import { holdRecordSchema, type Hold, type LiftHold } from '@shared/schemas/holds'
import { request } from './http'

const holdsAnswer = z.object({ holds: z.array(holdRecordSchema) })

export const setHold = (vehicleId: string, input: Hold) => request('POST', `/api/vehicles/${vehicleId}/holds`, holdsAnswer, input)

export const liftHold = (vehicleId: string, holdId: string, input: LiftHold) =>
  request('POST', `/api/vehicles/${vehicleId}/holds/${holdId}/lift`, holdsAnswer, input)
