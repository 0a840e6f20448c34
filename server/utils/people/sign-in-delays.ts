// Failed sign-ins slow down rather than lock out: after a few free tries each further failure of a scope
// doubles the wait before the next try is even checked, up to a cap. A guesser's failures against an account
// from elsewhere make the real person wait at most the account's cap (docs/security.md). A success clears the
// waits of its address and account, and of the account. Plain, so a unit test can check it.
export const SIGN_IN_DELAYS = {
  pair: { free: 5, firstS: 5, maxS: 60 }, // this address against this account
  account: { free: 10, firstS: 1, maxS: 15 }, // any address against this account
  address: { free: 50, firstS: 1, maxS: 60 } // this address against any account
} as const
export type Scope = keyof typeof SIGN_IN_DELAYS

export function delaySeconds(scope: Scope, failures: number): number {
  const d = SIGN_IN_DELAYS[scope]
  return failures < d.free ? 0 : Math.min(d.maxS, d.firstS * 2 ** (failures - d.free))
}
