import type { RequestHandler } from 'express'
import { badRequest, fieldIssue, summaryOf, type Issue } from '../errors'

const MESSAGE = 'Contains a NUL character (\\u0000), which cannot be stored. Remove it and try again.'
const MAX_DEPTH = 20

function findNul(value: unknown, path: string[], found: Issue[], depth = 0): void {
  if (found.length > 0 || depth > MAX_DEPTH) return
  if (typeof value === 'string') {
    if (value.includes('\u0000')) found.push(fieldIssue(path.join('.') || '(body)', 'common.nulCharacter', MESSAGE))
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => findNul(v, [...path, String(i)], found, depth + 1))
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) findNul(v, [...path, k], found, depth + 1)
  }
}

/**
 * PostgreSQL text cannot hold a NUL character: refused here, naming the field, instead of
 * failing in the database as a server error. Query strings and JSON bodies; the error handler
 * catches what arrives another way (a multipart field).
 */
export const refuseNulCharacters: RequestHandler = (req, _res, next) => {
  const found: Issue[] = []
  findNul(req.query, [], found)
  findNul(req.body, [], found)
  next(found.length > 0 ? badRequest(summaryOf(found), found) : undefined)
}
