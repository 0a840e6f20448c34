import { z } from 'zod'

// zod compiles fast parsers with new Function unless told not to; the browser runs under a content
// security policy without 'unsafe-eval', so it parses without code generation.
export default defineNuxtPlugin(() => {
  z.config({ jitless: true })
})
