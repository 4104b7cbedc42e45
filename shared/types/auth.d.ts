declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    systemRole: 'admin' | 'member'
    /** May use the scenario library (admins always may). */
    canAuthor: boolean
  }
  interface UserSession {
    loggedInAt?: number
    /** The user's session generation when this session was opened (see server/utils/auth.ts). */
    generation?: number
  }
}
export {}
