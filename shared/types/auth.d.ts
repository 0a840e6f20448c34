// What the sealed session cookie carries about the signed-in person.
declare module '#auth-utils' {
  interface User {
    id: number
    workshopId: number
    email: string
    name: string
    roles: ('admin' | 'tuner' | 'engineer' | 'tester' | 'auditor' | 'client')[]
  }
  // Kept in the cookie but never sent to the page: the person's session epoch at sign-in.
  interface SecureSessionData {
    sessionEpoch: number
  }
}

export {}
