// Whether a panel that scrolls on its own has more below what shows, so the screen can say so.
// Watches the panel's scrolling and the size of the panel and of its first child, which holds the content.
export function useMoreBelow(panel: Ref<HTMLElement | null>) {
  const more = ref(false)
  const measure = () => {
    const el = panel.value
    more.value = !!el && el.scrollHeight - el.scrollTop - el.clientHeight > 8
  }
  let observer: ResizeObserver | null = null
  watch(panel, (el, old) => {
    old?.removeEventListener('scroll', measure)
    observer?.disconnect()
    if (!el) return
    el.addEventListener('scroll', measure, { passive: true })
    observer = new ResizeObserver(measure)
    observer.observe(el)
    if (el.firstElementChild) observer.observe(el.firstElementChild)
    measure()
  }, { flush: 'post' })
  onBeforeUnmount(() => {
    panel.value?.removeEventListener('scroll', measure)
    observer?.disconnect()
  })
  return more
}
