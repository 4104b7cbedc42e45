// Every page needs a session except the sign-in, password and wall-view pages.
const PUBLIC = [/^\/signin$/, /^\/forgot$/, /^\/password\//, /^\/wall\//]

export default defineNuxtRouteMiddleware((to) => {
  if (PUBLIC.some(p => p.test(to.path))) return
  const { loggedIn } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/signin', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
})
