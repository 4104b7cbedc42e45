declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    systemRole: 'admin' | 'member'
  }
}
export {}
