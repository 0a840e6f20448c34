// Plain, so a unit test can watch it (no Nitro auto-imports here).
export interface Account { active: boolean, passwordHash: string }
export interface PasswordTools { verify: (hash: string, password: string) => Promise<boolean>, dummyHash: () => Promise<string> }

// The password is always hashed once, against a dummy hash when there is no active account, so an unknown,
// an inactive and a known e-mail take the same time and nobody learns which addresses have accounts.
export async function checkPassword(account: Account | null, password: string, tools: PasswordTools): Promise<boolean> {
  const usable = account?.active === true
  const hash = usable ? account.passwordHash : await tools.dummyHash()
  const matches = await tools.verify(hash, password)
  return usable && matches
}
