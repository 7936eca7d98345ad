import type { Href } from 'expo-router';

/**
 * The dose check pre-filled for a portion: its code, carbohydrate in grams (empty when unknown) and title; with `log`,
 * the log-a-meal flow (dose check, dose taken, save).
 */
export function doseCheckHref(portion: { code: string; carbGrams: number | null; label: string }, log = false, planMealId?: number): Href {
  return `/dose-check?portion=${encodeURIComponent(portion.code)}&carbs=${portion.carbGrams ?? ''}&label=${encodeURIComponent(portion.label)}${log ? '&log=1' : ''}${planMealId ? `&plan=${planMealId}` : ''}`;
}
