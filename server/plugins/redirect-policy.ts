import { NON_PAGE_CSP } from '../../shared/security-policy'

// A page that redirects (sign-in needed, a page moved) sends no HTML, so nuxt-security never fills the nonce of
// its policy: such an answer gets the policy of answers that are not pages, never a '{{nonce}}' placeholder.
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('beforeResponse', (event) => {
    const csp = getResponseHeader(event, 'content-security-policy')
    if (typeof csp === 'string' && csp.includes('{{nonce}}')) setResponseHeader(event, 'Content-Security-Policy', NON_PAGE_CSP)
  })
})
