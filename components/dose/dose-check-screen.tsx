import { Link } from 'expo-router';
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';
import { useIsOnline } from '../api/online';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { DoseBreakdownView } from './dose-breakdown';
import { DoseCaution } from './dose-caution';
import { DoseExtraFields, DoseMealFields } from './dose-form-fields';
import { DoseOffline } from './dose-offline';
import { LogMealPanel } from './log-meal-panel';
import { useDoseCheck, type DoseCheckParams } from './use-dose-check';

export type { DoseCheckParams };

/** The dose check: carbohydrate, glucose, exercise → the server's suggestion as a readable sum, caution always shown; refused offline. */
export function DoseCheckScreen(params: DoseCheckParams) {
  const { profile, isPending, settings, kinds, suggest, lookup, pickPortion, form, submit, formError, picked, resultRef } = useDoseCheck(params);
  const { isWide } = useLayout();
  const online = useIsOnline();
  const { reset: forgetAnswer } = suggest;
  useEffect(() => {
    if (!online) forgetAnswer();
  }, [online, forgetAnswer]);

  // Offline nothing is worked out, and an answer already on screen goes too: a stale suggestion is a hazard.
  if (!online) return <DoseOffline log={!!params.log} />;
  if (isPending || !profile || settings.isPending || kinds.isPending) return <LoadingState />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => void settings.refetch()} />;
  if (kinds.isError) return <ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} />;

  const ready = !!settings.data.settings && kinds.data.length > 0;
  const notWorkedOut = formError ?? form.formState.errors.root?.message;
  return (
    <Screen title={params.log ? 'Log a meal' : 'Check a dose'} subtitle={`For ${profile.displayName}`} backHref="/">
      {!ready ? (
        <Callout tone="caution" title="No dose can be suggested yet">
          <Text>Carbwright needs the units and safety limits and at least one day kind with the ratios from your diabetes team.</Text>
          <Link href="/settings" asChild>
            <Button label="Set up ratios and limits" variant="secondary" />
          </Link>
        </Callout>
      ) : null}
      {/* On a phone the answer comes below the form: the caution is read before anything is worked out. */}
      {isWide ? null : <DoseCaution />}
      {picked ? (
        <Text variant="lead">
          For: {picked.label ?? 'a portion'}
          {picked.code ? ` (portion ${picked.code})` : ''}
        </Text>
      ) : null}
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.column, isWide && styles.columnWide]}>
          <DoseMealFields
            control={form.control}
            kinds={kinds.data}
            carbBasis={settings.data.carbBasis}
            carbUnit={profile.carbUnit}
            glucoseUnit={profile.glucoseUnit}
            lookingUp={lookup.isPending}
            onLookup={pickPortion}
          />
          <DoseExtraFields control={form.control} />
          {notWorkedOut ? <Callout tone="danger" title="Not worked out">{notWorkedOut}</Callout> : null}
          <Button label="Check a dose" size="lg" loading={suggest.isPending} onPress={() => void submit()} />
        </View>
        <View ref={resultRef} style={[styles.column, isWide && styles.columnWide]} aria-live="polite">
          {isWide ? <DoseCaution /> : null}
          {suggest.data ? <DoseBreakdownView result={suggest.data} /> : <Text color="textMuted">The suggestion appears here with every part of the sum.</Text>}
          {suggest.data && suggest.variables && profile.access !== 'clinician' ? (
            <LogMealPanel
              key={suggest.submittedAt}
              profileId={profile.id}
              request={suggest.variables}
              suggestion={suggest.data}
              portionCode={picked?.code}
              label={picked?.label}
              planMealId={params.plan ? Number(params.plan) || undefined : undefined}
            />
          ) : null}
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
});
