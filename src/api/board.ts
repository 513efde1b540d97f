import { boardSchema } from '@shared/schemas/board'
import { request } from './http'

export const fetchBoard = () => request('GET', '/api/board', boardSchema)
