declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    systemRole: 'admin' | 'member'
    /** May use the scenario library (admins always may). */
    canAuthor: boolean
  }
}
export {}
