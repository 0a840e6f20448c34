// The content security policy of every answer that is not a page (JSON, CSV, PDF, scripts, redirects): nothing
// may run or be framed. Pages get nuxt-security's policy with a fresh nonce (docs/security.md).
export const NON_PAGE_CSP = "default-src 'none'; frame-ancestors 'none'"
