/** Downloads are a browser feature; the native apps export from the web app. */
export function saveFile(_blob: Blob, _filename: string): void {}

export const canSaveFile = false;
