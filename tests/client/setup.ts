// Vuetify measures elements with ResizeObserver, which jsdom does not have.
class ResizeObserverStub {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
}
globalThis.ResizeObserver ??= ResizeObserverStub as unknown as typeof ResizeObserver;

// Vuetify's overlays (dialogs, menus) position themselves against the visual viewport.
if (!('visualViewport' in globalThis) || !globalThis.visualViewport) {
  const viewport = new EventTarget() as EventTarget & Record<string, number>;
  Object.assign(viewport, { width: 1024, height: 768, offsetLeft: 0, offsetTop: 0, pageLeft: 0, pageTop: 0, scale: 1 });
  Object.defineProperty(globalThis, 'visualViewport', { value: viewport, configurable: true });
}
