/** Light or dark theme, remembered in a cookie so the server renders the right one. */
export function useTheme() {
  const theme = useCookie<'light' | 'dark'>('bw-theme', { default: () => 'light', sameSite: 'lax' })
  useHead({ htmlAttrs: { class: computed(() => (theme.value === 'dark' ? 'dark' : '')) } })
  const toggle = () => { theme.value = theme.value === 'dark' ? 'light' : 'dark' }
  return { theme, toggle }
}
