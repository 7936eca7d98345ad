import type { Href } from 'expo-router';

/** The dose check pre-filled for a portion: its code, carbohydrate in grams (empty when unknown) and title. */
export function doseCheckHref(portion: { code: string; carbGrams: number | null; label: string }): Href {
  return `/dose-check?portion=${encodeURIComponent(portion.code)}&carbs=${portion.carbGrams ?? ''}&label=${encodeURIComponent(portion.label)}`;
}
