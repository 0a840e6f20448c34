// A button's action that goes to the server: busy while it runs (a second press does nothing), and the
// server's plain message when it is refused.
export function useAction(fallback = 'That did not work; please try again.') {
  const busy = ref(false)
  const problem = ref('')
  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    if (busy.value) return undefined
    busy.value = true
    problem.value = ''
    try {
      return await action()
    } catch (e) {
      problem.value = errorMessage(e, fallback)
      return undefined
    } finally {
      busy.value = false
    }
  }
  return { busy, problem, run }
}
