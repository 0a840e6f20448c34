import type { UserCreate, UserUpdate } from '~~/shared/schemas/user'
import type { Role } from '~~/shared/schemas/roles'

export interface PersonView { id: number, email: string, name: string, roles: Role[], active: boolean }

export function usePeople() {
  const list = useFetch<{ items: PersonView[], total: number }>('/api/users', { key: cacheKeys.people })
  // Each write answers the person as saved: put it in the list instead of reading the list again.
  async function add(input: UserCreate) {
    const person = await $fetch<PersonView>('/api/users', { method: 'POST', body: input })
    if (list.data.value) list.data.value = { items: [...list.data.value.items, person], total: list.data.value.total + 1 }
  }
  async function change(id: number, input: UserUpdate) {
    const person = await $fetch<PersonView>(`/api/users/${id}`, { method: 'PATCH', body: input })
    if (list.data.value) list.data.value = { ...list.data.value, items: list.data.value.items.map(p => p.id === id ? person : p) }
  }
  return { ...list, add, change }
}
