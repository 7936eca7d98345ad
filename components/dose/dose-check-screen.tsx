import { Link } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { Controller, useForm, type FieldPath } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { formatCarb } from '../../shared/compute/units';
import { doseRequestSchema } from '../../shared/schemas/dose';
import { useActiveProfile } from '../api/auth';
import { ApiError } from '../api/client';
import { useDoseSuggestion, usePortionLookup } from '../api/dose';
import { useDayKindDays, useDayKinds, useProfileSettings } from '../api/profile-settings';
import { ChoiceGroup } from '../ui/choice-group';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { FormTextField } from '../ui/form-text-field';
import { TextField } from '../ui/text-field';
import { Screen } from '../ui/screen';
import { scrollIntoView } from '../ui/scroll-into-view';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { DoseBreakdownView } from './dose-breakdown';
import { DoseCaution } from './dose-caution';
import { EarlierDosesFields, earlierDoseField, earlierDosesRequest, type EarlierDoseRow } from './earlier-doses-fields';

type Values = {
  carbsGrams: string;
  glucose: string;
  glucoseMinutesAgo: string;
  localTime: string;
  dayKindId: number | null;
  exerciseIntensity: 'none' | 'light' | 'moderate' | 'hard';
  exerciseDuration: string;
  exerciseStartsIn: string;
  splitOn: boolean;
  splitNow: string;
  splitLater: string;
  earlierDoses: EarlierDoseRow[];
  fatGrams: string;
  proteinGrams: string;
};

/** Where an error on the request lands in the form. */
const FIELD_OF: Record<string, FieldPath<Values>> = {
  carbsGrams: 'carbsGrams',
  glucose: 'glucose',
  glucoseTakenAt: 'glucoseMinutesAgo',
  localTime: 'localTime',
  dayKindId: 'dayKindId',
  'exercise.durationMinutes': 'exerciseDuration',
  'exercise.startsInMinutes': 'exerciseStartsIn',
  'split.nowPercent': 'splitNow',
  'split.laterMinutes': 'splitLater',
  fatGrams: 'fatGrams',
  proteinGrams: 'proteinGrams',
};

const ymd = (d: Date) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
const hhmm = (d: Date) => `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
const blank = (s: string) => s.trim() === '';

export type DoseCheckParams = { carbs?: string; portion?: string; label?: string };

/** The dose check: carbohydrate, glucose, exercise → the server's suggestion as a readable sum, caution always shown. */
export function DoseCheckScreen({ carbs, portion, label }: DoseCheckParams) {
  const { profile, isPending } = useActiveProfile();
  const settings = useProfileSettings(profile?.id);
  const kinds = useDayKinds(profile?.id);
  const [today] = useState(() => ymd(new Date()));
  const todayKind = useDayKindDays(profile?.id, today, today);
  const suggest = useDoseSuggestion(profile?.id ?? 0);
  const { isWide } = useLayout();
  const [formError, setFormError] = useState<string>();
  const resultRef = useRef<View>(null);
  const [picked, setPicked] = useState(portion || label ? { code: portion, label } : null);
  const [code, setCode] = useState('');
  const [codeError, setCodeError] = useState<string>();
  const lookup = usePortionLookup();
  const form = useForm<Values>({
    defaultValues: {
      carbsGrams: carbs && Number.isFinite(Number(carbs)) ? String(Math.round(Number(carbs) * 10) / 10) : '',
      glucose: '',
      glucoseMinutesAgo: '0',
      localTime: hhmm(new Date()),
      dayKindId: null,
      exerciseIntensity: 'none',
      exerciseDuration: '45',
      exerciseStartsIn: '60',
      splitOn: false,
      splitNow: '60',
      splitLater: '60',
      earlierDoses: [],
      fatGrams: '',
      proteinGrams: '',
    },
  });
  const defaultKind = todayKind.isPending ? null : (todayKind.data?.[0]?.dayKindId ?? kinds.data?.find((k) => k.isDefault)?.id ?? null);
  useEffect(() => {
    if (defaultKind != null && form.getValues('dayKindId') == null) form.setValue('dayKindId', defaultKind);
  }, [defaultKind, form]);
  const { reset: clearResult } = suggest;
  useEffect(() => {
    const sub = form.watch(() => clearResult());
    return () => sub.unsubscribe();
  }, [form, clearResult]);

  if (isPending || !profile || settings.isPending || kinds.isPending) return <LoadingState />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => void settings.refetch()} />;
  if (kinds.isError) return <ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} />;

  const unit = profile.glucoseUnit === 'mmol_l' ? 'mmol/L' : 'mg/dL';
  const ready = !!settings.data.settings && kinds.data.length > 0;
  const intensity = form.watch('exerciseIntensity');
  const splitOn = form.watch('splitOn');
  const carbsTyped = Number(form.watch('carbsGrams').replace(',', '.'));

  const onSubmit = form.handleSubmit((v) => {
    setFormError(undefined);
    form.clearErrors();
    const now = Date.now();
    const minutesAgo = (s: string) => {
      const minutes = Number(s.replace(',', '.') || 0);
      return Number.isFinite(minutes) && minutes >= 0 ? new Date(now - minutes * 60_000).toISOString() : 'not a time';
    };
    const readingAt = blank(v.glucose) ? null : minutesAgo(v.glucoseMinutesAgo);
    if (readingAt === 'not a time') {
      form.setError('glucoseMinutesAgo', { message: 'Enter how many minutes ago the reading was taken (0 or more).' });
      return;
    }
    const earlier = earlierDosesRequest(v.earlierDoses, now);
    const rowOfDose = earlier.doses.map((d) => d.row);
    const request = {
      carbsGrams: v.carbsGrams,
      glucose: blank(v.glucose) ? null : v.glucose,
      glucoseUnit: profile.glucoseUnit,
      glucoseTakenAt: readingAt,
      mealAt: new Date(now).toISOString(),
      localTime: v.localTime,
      dayKindId: v.dayKindId,
      date: today,
      earlierDoses: earlier.doses.map(({ units, takenAt }) => ({ units, takenAt })),
      exercise: v.exerciseIntensity === 'none' ? null : { intensity: v.exerciseIntensity, durationMinutes: v.exerciseDuration, startsInMinutes: v.exerciseStartsIn },
      split: v.splitOn ? { nowPercent: v.splitNow, laterMinutes: v.splitLater } : null,
      fatGrams: v.fatGrams,
      proteinGrams: v.proteinGrams,
    };
    const place = (fieldErrors: Record<string, string[]>) => {
      let unplaced: string | undefined;
      for (const [path, messages] of Object.entries(fieldErrors)) {
        const field = FIELD_OF[path] ?? (earlierDoseField(path, rowOfDose) as FieldPath<Values> | undefined);
        if (field) form.setError(field, { message: messages[0] });
        else unplaced = messages[0];
      }
      if (unplaced) setFormError(unplaced);
    };
    const parsed = doseRequestSchema.safeParse(request);
    if (!parsed.success || Object.keys(earlier.errors).length) {
      const errors: Record<string, string[]> = { ...earlier.errors };
      if (parsed.success) return place(errors);
      for (const issue of parsed.error.issues) (errors[issue.path.join('.')] ??= []).push(issue.message);
      place(errors);
      return;
    }
    suggest.mutate(parsed.data, {
      // On a phone the answer sits below the form: bring it (and the caution above it) into view.
      onSuccess: () => requestAnimationFrame(() => scrollIntoView(resultRef)),
      onError: (error) => {
        if (error instanceof ApiError && error.fieldErrors) place(error.fieldErrors);
        else setFormError(error instanceof ApiError ? error.message : 'Something went wrong. Please try again.');
      },
    });
  });

  return (
    <Screen title="Check a dose" subtitle={`For ${profile.displayName}`} backHref="/">
      {!ready ? (
        <Callout tone="caution" title="No dose can be suggested yet">
          <Text>
            Carbwright needs the units and safety limits and at least one day kind with the ratios from your diabetes team.
          </Text>
          <Link href="/settings" asChild>
            <Button label="Set up ratios and limits" variant="secondary" />
          </Link>
        </Callout>
      ) : null}
      {picked ? (
        <Text variant="lead">
          For: {picked.label ?? 'a portion'}
          {picked.code ? ` (portion ${picked.code})` : ''}
        </Text>
      ) : null}
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.column, isWide && styles.columnWide]}>
          <Card>
            <View style={styles.pair}>
              <View style={styles.grow}>
                <TextField
                  label="Portion code (optional)"
                  value={code}
                  onChangeText={setCode}
                  autoCapitalize="characters"
                  error={codeError}
                  hint="From a container's label: fills in its carbohydrate."
                  style={styles.input}
                />
              </View>
              <View style={styles.lookup}>
                <Button
                  variant="secondary"
                  label="Use this portion"
                  loading={lookup.isPending}
                  disabled={!code.trim()}
                  onPress={() => {
                    setCodeError(undefined);
                    lookup.mutate(code, {
                      onSuccess: (p) => {
                        if (p.carb.grams == null) return setCodeError('The carbohydrate of this portion is not known; type it in.');
                        form.setValue('carbsGrams', String(Math.round(p.carb.grams * 10) / 10));
                        setPicked({ code: p.code, label: p.profileId === profile.id ? p.recipeTitle : `${p.recipeTitle} — from ${p.profileName}'s batch` });
                      },
                      onError: (error) => setCodeError(error instanceof ApiError && error.status === 404 ? 'No portion has that code.' : 'That code could not be looked up.'),
                    });
                  }}
                />
              </View>
            </View>
            <FormTextField
              control={form.control}
              name="carbsGrams"
              label={`Carbohydrate (${settings.data.carbBasis === 'available' ? 'available' : 'total'})`}
              unit="g"
              inputMode="decimal"
              hint={
                Number.isFinite(carbsTyped) && carbsTyped > 0 && profile.carbUnit !== 'g'
                  ? `= ${formatCarb(carbsTyped, profile.carbUnit)}`
                  : 'In grams, as counted in your profile’s basis.'
              }
            />
            <View style={styles.pair}>
              <View style={styles.grow}>
                <FormTextField control={form.control} name="glucose" style={styles.input} label="Glucose now" unit={unit} inputMode="decimal" hint="Leave empty if you have no reading: the correction is then left out." />
              </View>
              <View style={styles.grow}>
                <FormTextField control={form.control} name="glucoseMinutesAgo" style={styles.input} label="Reading taken" unit="min ago" inputMode="numeric" />
              </View>
            </View>
            <FormTextField control={form.control} name="localTime" label="Meal time" placeholder="12:30" hint="Chooses the time block of the day kind." />
            {kinds.data.length ? (
              <Controller
                control={form.control}
                name="dayKindId"
                render={({ field, fieldState }) => (
                  <ChoiceGroup
                    label="Kind of day"
                    choices={kinds.data.map((k) => ({ value: k.id, label: k.name }))}
                    value={field.value}
                    onChange={field.onChange}
                    error={fieldState.error?.message}
                  />
                )}
              />
            ) : null}
          </Card>
          <Card>
            <Text variant="heading">Also</Text>
            <Controller
              control={form.control}
              name="exerciseIntensity"
              render={({ field }) => (
                <ChoiceGroup
                  label="Exercise after the meal"
                  choices={[
                    { value: 'none', label: 'None' },
                    { value: 'light', label: 'Light' },
                    { value: 'moderate', label: 'Moderate' },
                    { value: 'hard', label: 'Hard' },
                  ]}
                  value={field.value}
                  onChange={field.onChange}
                />
              )}
            />
            {intensity !== 'none' ? (
              <View style={styles.pair}>
                <View style={styles.grow}>
                  <FormTextField control={form.control} name="exerciseDuration" style={styles.input} label="For how long" unit="min" inputMode="numeric" />
                </View>
                <View style={styles.grow}>
                  <FormTextField control={form.control} name="exerciseStartsIn" style={styles.input} label="Starting in" unit="min" inputMode="numeric" />
                </View>
              </View>
            ) : null}
            <EarlierDosesFields control={form.control} />
            <Controller
              control={form.control}
              name="splitOn"
              render={({ field }) => (
                <ChoiceGroup
                  label="Split the dose (slow or high-fat meal)"
                  choices={[{ value: false, label: 'No' }, { value: true, label: 'Yes' }]}
                  value={field.value}
                  onChange={field.onChange}
                />
              )}
            />
            {splitOn ? (
              <View style={styles.pair}>
                <View style={styles.grow}>
                  <FormTextField control={form.control} name="splitNow" style={styles.input} label="Now" unit="%" inputMode="numeric" />
                </View>
                <View style={styles.grow}>
                  <FormTextField control={form.control} name="splitLater" style={styles.input} label="Rest after" unit="min" inputMode="numeric" />
                </View>
              </View>
            ) : null}
            <View style={styles.pair}>
              <View style={styles.grow}>
                <FormTextField control={form.control} name="fatGrams" style={styles.input} label="Fat (optional)" unit="g" inputMode="decimal" />
              </View>
              <View style={styles.grow}>
                <FormTextField control={form.control} name="proteinGrams" style={styles.input} label="Protein (optional)" unit="g" inputMode="decimal" />
              </View>
            </View>
          </Card>
          {formError ? <Callout tone="danger" title="Not worked out">{formError}</Callout> : null}
          <Button label="Work out a dose" size="lg" loading={suggest.isPending} onPress={onSubmit} />
        </View>
        <View ref={resultRef} style={[styles.column, isWide && styles.columnWide]} aria-live="polite">
          <DoseCaution />
          {suggest.data ? (
            <DoseBreakdownView result={suggest.data} />
          ) : (
            <Text color="textMuted">The suggestion appears here with every part of the sum.</Text>
          )}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { gap: 16 },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: 16 },
  columnWide: { flex: 1 },
  pair: { flexDirection: 'row', gap: 12, flexWrap: 'wrap' },
  grow: { flex: 1, minWidth: 140 },
  input: { minWidth: 0 },
  lookup: { justifyContent: 'flex-start', paddingTop: 26 },
});
