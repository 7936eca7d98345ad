/** Printing is a browser feature; on native there is nothing to do (the sheet can be shared as a screenshot). */
export function printPage(): void {}

/** Print styles exist only on the web. */
export function usePrintStyles(): void {}

export const canPrint = false;
