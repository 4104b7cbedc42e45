// Start-up security settings that apply to every request and page.
export default defineNitroPlugin((nitroApp) => {
  // Served over HTTPS, the session cookie is Secure: nuxt-auth-utils reads runtimeConfig.session of each request.
  if (serverConfig().secureCookies) {
    nitroApp.hooks.hook('request', (event) => {
      useRuntimeConfig(event).session.cookie.secure = true
    })
  }
  if (import.meta.dev) return
  // Rendered pages get the policy with the hashes of their own inline scripts.
  nitroApp.hooks.hook('render:response', (response) => {
    if (typeof response.body !== 'string') return
    response.headers = { ...response.headers, 'content-security-policy': contentSecurityPolicy(inlineScriptHashes(response.body)) }
  })
})
