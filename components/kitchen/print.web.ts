import { useEffect } from 'react';

const PRINT_CSS = `
@media print {
  @page { size: A4; margin: 10mm; }
  html, body, #root { height: auto !important; overflow: visible !important; }
  #root * { overflow: visible !important; }
  [data-print="hide"] { display: none !important; }
  [data-print="label"] { break-inside: avoid; page-break-inside: avoid; }
}`;

/** Opens the browser's print dialog. */
export function printPage(): void {
  window.print();
}

/** Adds the label sheet's print styles while the sheet is shown. */
export function usePrintStyles(): void {
  useEffect(() => {
    const el = document.createElement('style');
    el.setAttribute('data-carbwright', 'label-print');
    el.textContent = PRINT_CSS;
    document.head.appendChild(el);
    return () => el.remove();
  }, []);
}

export const canPrint = true;
