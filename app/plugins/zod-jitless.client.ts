import { z } from 'zod'

// zod compiles fast parsers with new Function unless told not to; the browser runs under a content
// security policy without 'unsafe-eval', so it parses without code generation. Set when the entry
// loads, before the router plugin pulls in the pages and their schemas.
z.config({ jitless: true })

export default defineNuxtPlugin(() => {})
