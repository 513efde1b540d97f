import type { User } from '@shared/schemas/users'

declare module 'express-session' {
  interface SessionData {
    /** Who signed in. Deactivating a user, changing their role or password deletes their sessions, so this cannot outlive them. */
    user?: User
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
