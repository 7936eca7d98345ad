import { daysUntil } from '../../shared/compute/use-by';

/** Today's local calendar date as YYYY-MM-DD. */
export function localToday(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** Whole grams for weights. */
export function gramsText(grams: number): string {
  return `${Math.round(grams)} g`;
}

type Storage = 'fridge' | 'freezer';

/** What a batch's date is called (README glossary): the fridge date is a use-by date, the freezer date a best-quality date. */
export function dateWord(storage: Storage): 'use by' | 'best quality by' {
  return storage === 'freezer' ? 'best quality by' : 'use by';
}

/**
 * "2 days left", "last day", "past its use-by date 3 days ago" and the tone to show it with. Past a freezer
 * portion's best-quality date is a caution, not a danger: it stays safe while frozen.
 */
export function shelfStatus(useBy: string, today: string, storage: Storage = 'fridge'): { text: string; tone: 'ok' | 'caution' | 'danger' } {
  const days = daysUntil(useBy, today);
  const ago = `${-days} day${days === -1 ? '' : 's'} ago`;
  if (days < 0 && storage === 'freezer') return { text: `Past its best-quality date (${ago}); safe while it stayed frozen`, tone: 'caution' };
  if (days < 0) return { text: `Past its use-by date (${ago})`, tone: 'danger' };
  if (days === 0) return { text: 'Use today (last day)', tone: 'caution' };
  if (days === 1) return { text: '1 day left', tone: 'caution' };
  return { text: `${days} days left`, tone: 'ok' };
}

