/** The one way the web app keeps things on this device: web storage when there is one (tests and native have none). */
export function deviceStorage(): Storage | undefined {
  try {
    return typeof globalThis.localStorage === 'undefined' ? undefined : globalThis.localStorage;
  } catch {
    return undefined;
  }
}
