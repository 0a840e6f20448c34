import { z } from 'zod'

// The content security policy forbids generated code, so zod validates without its compiled fast path.
export default defineNuxtPlugin(() => {
  z.config({ jitless: true })
})
