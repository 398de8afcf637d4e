// Marks <html data-hydrated> once Nuxt has hydrated the server-rendered page and the browser is
// idle, so browser tests act only when every event handler is attached.
export default defineNuxtPlugin(() => {
  onNuxtReady(() => { document.documentElement.dataset.hydrated = 'true' })
})
