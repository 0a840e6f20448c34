import type { UserCreate, UserUpdate } from '~~/shared/schemas/user'
import type { Role } from '~~/shared/schemas/roles'

export interface PersonView { id: number, email: string, name: string, roles: Role[], active: boolean }

export function usePeople() {
  const list = useFetch<{ items: PersonView[], total: number }>('/api/users', { key: 'people' })
  async function add(input: UserCreate) {
    await $fetch('/api/users', { method: 'POST', body: input })
    await list.refresh()
  }
  async function change(id: number, input: UserUpdate) {
    await $fetch(`/api/users/${id}`, { method: 'PATCH', body: input })
    await list.refresh()
  }
  return { ...list, add, change }
}
