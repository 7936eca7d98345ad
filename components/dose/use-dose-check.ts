import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { View } from 'react-native';
import type { DoseRequest } from '../../shared/schemas/dose';
import { useActiveProfile } from '../api/auth';
import { ApiError } from '../api/client';
import { useDayKindDays } from '../api/days';
import { useDoseSuggestion } from '../api/dose';
import { usePortionLookup } from '../api/portions';
import { useDayKinds, useProfileSettings } from '../api/profile-settings';
import { localToday } from '../kitchen/kitchen-format';
import { applyServerErrors } from '../ui/form-errors';
import { scrollIntoView } from '../ui/scroll-into-view';
import { doseFormDefaults, doseFormSchema, toDoseRequest, type DoseFormValues, type DoseRequestContext } from './dose-request';

/** `log`: the log-a-meal flow (the reading counts as taken now unless changed; the result offers Save). */
export type DoseCheckParams = { carbs?: string; portion?: string; label?: string; log?: string; /** The week plan's meal being logged. */ plan?: string };

/** Everything the dose check needs: its data, the one form, the portion lookup and the server's answer. */
export function useDoseCheck({ carbs, portion, label, log }: DoseCheckParams) {
  const { profile, isPending } = useActiveProfile();
  const settings = useProfileSettings(profile?.id);
  const kinds = useDayKinds(profile?.id);
  const [today] = useState(() => localToday());
  const todayKind = useDayKindDays(profile?.id, today, today);
  const suggest = useDoseSuggestion(profile?.id ?? 0);
  const lookup = usePortionLookup();
  const resultRef = useRef<View>(null);
  const [formError, setFormError] = useState<string>();
  const [picked, setPicked] = useState(portion || label ? { code: portion, label } : null);
  const contextRef = useRef<Omit<DoseRequestContext, 'now'>>({ glucoseUnit: 'mmol_l', date: today });
  contextRef.current = { glucoseUnit: profile?.glucoseUnit ?? 'mmol_l', date: today };
  const resolver = useMemo(() => zodResolver(doseFormSchema(() => ({ ...contextRef.current, now: Date.now() }))), []);
  const form = useForm<DoseFormValues, unknown, DoseRequest>({ resolver, defaultValues: doseFormDefaults(carbs, new Date()) });
  // Logging a meal, a reading typed now was taken now: the time fills in once there is a reading, never before it.
  const glucoseTyped = useWatch({ control: form.control, name: 'glucose' }).trim() !== '';
  useEffect(() => {
    if (log && glucoseTyped && !form.getFieldState('glucoseMinutesAgo').isDirty && form.getValues('glucoseMinutesAgo').trim() === '') {
      form.setValue('glucoseMinutesAgo', '0');
    }
  }, [log, glucoseTyped, form]);

  const defaultKind = todayKind.isPending ? null : (todayKind.data?.[0]?.dayKindId ?? kinds.data?.find((k) => k.isDefault)?.id ?? null);
  useEffect(() => {
    if (defaultKind != null && form.getValues('dayKindId') == null) form.setValue('dayKindId', defaultKind);
  }, [defaultKind, form]);
  const { reset: clearResult } = suggest;
  useEffect(() => {
    const sub = form.watch(() => clearResult());
    return () => sub.unsubscribe();
  }, [form, clearResult]);

  const submit = form.handleSubmit((request) => {
    setFormError(undefined);
    suggest.mutate(request, {
      // On a phone the answer sits below the form: bring it into view.
      onSuccess: () => requestAnimationFrame(() => scrollIntoView(resultRef)),
      onError: (error) => {
        const { fieldOf } = toDoseRequest(form.getValues(), { ...contextRef.current, now: Date.now() });
        setFormError(applyServerErrors(error, form.setError, fieldOf));
      },
    });
  });

  const pickPortion = () => {
    const code = form.getValues('portionCode');
    form.clearErrors('portionCode');
    lookup.mutate(code, {
      onSuccess: (p) => {
        if (p.carb.grams == null) return form.setError('portionCode', { message: 'The carbohydrate of this portion is unknown; type it in.' });
        form.setValue('carbsGrams', String(Math.round(p.carb.grams * 10) / 10));
        setPicked({ code: p.code, label: p.profileId === profile?.id ? p.recipeTitle : `${p.recipeTitle} — from ${p.profileName}'s batch` });
      },
      onError: (error) =>
        form.setError('portionCode', { message: error instanceof ApiError && error.status === 404 ? 'No portion has that code.' : 'That code could not be looked up.' }),
    });
  };

  return { profile, isPending, settings, kinds, suggest, lookup, pickPortion, form, submit, formError, picked, resultRef };
}
