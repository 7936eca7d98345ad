/** Saving a downloaded file is a browser feature; on native there is nothing to do yet. */
export function saveFile(_blob: Blob, _name: string): void {}
