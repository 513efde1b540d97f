import type { User } from '../shared/schemas/users'

declare module 'express-session' {
  interface SessionData {
    userId?: string
    csrfToken?: string
    /** When the staff member signed in; a session ends 12 hours after it whatever the activity. */
    signedInAt?: number
  }
}

declare global {
  namespace Express {
    interface Request {
      user?: User
    }
  }
}
