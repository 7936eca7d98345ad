import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { DoseRequest, DoseSuggestion } from '../../shared/schemas/dose';
import { logMealInputSchema, type LogGroup, type LogMealInput } from '../../shared/schemas/logbook';
import { useLogMeal, useUndoLogGroup } from '../api/logbook';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormTextField } from '../ui/form-text-field';
import { requestFormSchema } from '../ui/request-form-schema';
import { Text } from '../ui/text';
import { formatDoseUnits } from './insulin-format';

/** What was actually taken, as typed: pre-filled with the suggestion, both parts of a two-part dose. */
export type TakenValues = { nowUnits: string; laterUnits: string };

type Context = { request: DoseRequest; suggestion: DoseSuggestion; portionCode?: string; label?: string; planMealId?: number };

const blank = (s: string) => s.trim() === '';

/** The suggestion's parts as the form starts: now and later for a two-part dose, else the whole dose now. */
export function takenDefaults(s: DoseSuggestion): TakenValues {
  if (s.status !== 'ok') return { nowUnits: '', laterUnits: '' };
  if (s.split) return { nowUnits: String(s.split.nowUnits), laterUnits: String(s.split.laterUnits) };
  return { nowUnits: s.breakdown.doseUnits > 0 ? String(s.breakdown.doseUnits) : '', laterUnits: '' };
}

/** The log-a-meal request from the dose check that was shown and the units typed as taken. */
export function toLogMealRequest(v: TakenValues, { request, suggestion, portionCode, label, planMealId }: Context) {
  const mealAt = request.mealAt ?? new Date().toISOString();
  const laterAt = suggestion.status === 'ok' && suggestion.split ? new Date(Date.parse(mealAt) + suggestion.split.laterMinutes * 60_000).toISOString() : mealAt;
  const doses = [
    ...(blank(v.nowUnits) ? [] : [{ units: v.nowUnits, occurredAt: mealAt }]),
    ...(blank(v.laterUnits) ? [] : [{ units: v.laterUnits, occurredAt: laterAt }]),
  ];
  const body = {
    occurredAt: mealAt,
    meal: portionCode
      ? { source: 'portion', portionCode }
      : { source: 'typed', carbsGrams: request.carbsGrams, note: label || 'Typed in the dose check' },
    reading: request.glucose != null ? { glucose: request.glucose, glucoseUnit: request.glucoseUnit, occurredAt: request.glucoseTakenAt ?? mealAt } : null,
    doses,
    // The whole suggestion shown (with its caution and engine versions) and the request behind it.
    suggestion: { ...suggestion, request },
    ...(planMealId ? { planMealId } : {}),
  };
  const fieldOf = (path: string) => (path.startsWith('doses.0') ? (blank(v.nowUnits) ? 'laterUnits' : 'nowUnits') : path.startsWith('doses.1') ? 'laterUnits' : undefined);
  return { request: body, fieldOf };
}

/**
 * After a dose check: the dose actually taken (pre-filled with the suggestion, editable, both parts) and one Save that
 * logs the meal, the reading, the dose and the portion eaten together; then one Undo that reverts them all.
 */
export function LogMealPanel({ profileId, ...context }: Context & { profileId: number }) {
  const save = useLogMeal(profileId);
  const undo = useUndoLogGroup(profileId);
  const [saved, setSaved] = useState<LogGroup | null>(null);
  const [formError, setFormError] = useState<string>();
  const ctxRef = useRef(context);
  ctxRef.current = context;
  const resolver = useMemo(() => zodResolver(requestFormSchema(logMealInputSchema, (v: TakenValues) => toLogMealRequest(v, ctxRef.current))), [ctxRef]);
  const form = useForm<TakenValues, unknown, LogMealInput>({ resolver, defaultValues: takenDefaults(context.suggestion) });
  const split = context.suggestion.status === 'ok' && context.suggestion.split;

  const submit = form.handleSubmit((input) => {
    setFormError(undefined);
    save.mutate(input, {
      onSuccess: setSaved,
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['nowUnits', 'laterUnits'])),
    });
  });

  if (saved) {
    const doses = saved.entries.filter((e) => e.kind === 'rapid_dose');
    const undone = undo.isSuccess;
    return (
      <Callout tone={undone ? 'info' : 'ok'} title={undone ? 'Undone: nothing is in the logbook' : 'Saved in the logbook'}>
        <Text>
          {undone
            ? 'The meal, the reading and the dose were taken out, and the portion is back in the fridge list.'
            : `${context.label ?? 'The meal'}${saved.entries.some((e) => e.kind === 'reading') ? ', the reading' : ''}` +
              `${doses.length ? ` and ${doses.map((d) => formatDoseUnits(d.dose!.units)).join(' + ')} taken` : ''} logged at ${saved.entries[0]?.localTime}.`}
        </Text>
        {undo.isError ? <Text color="danger">{undo.error.message}</Text> : null}
        {undone ? null : <Button variant="secondary" label="Undo" loading={undo.isPending} onPress={() => undo.mutate(saved.groupKey)} />}
      </Callout>
    );
  }
  return (
    <Card aria-label="Log this meal">
      <Text variant="heading">Log this meal</Text>
      <Text color="textMuted">What did you take? It starts as the suggestion; change it to what you injected.</Text>
      {formError ? <Callout tone="danger" title="Not saved">{formError}</Callout> : null}
      <View style={styles.row}>
        <FormTextField control={form.control} name="nowUnits" style={styles.input} label={split ? 'Taken now' : 'Rapid-acting insulin taken'} unit="units" inputMode="decimal" />
        {split ? <FormTextField control={form.control} name="laterUnits" style={styles.input} label={`Later part (in ${split.laterMinutes} min)`} unit="units" inputMode="decimal" /> : null}
      </View>
      <Button label="Save to the logbook" size="lg" loading={save.isPending} onPress={() => void submit()} />
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
  input: { minWidth: 140, flex: 1 },
});
