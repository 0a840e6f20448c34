// What the sealed session cookie carries about the signed-in person.
declare module '#auth-utils' {
  interface User {
    id: number
    workshopId: number
    email: string
    name: string
    roles: ('admin' | 'tuner' | 'engineer' | 'tester' | 'auditor' | 'client')[]
  }
}

export {}
