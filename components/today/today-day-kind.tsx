import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { useDayKinds } from '../api/profile-settings';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { ChoiceGroup } from '../ui/choice-group';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { useDayKindDays, useSetDayKindDay } from '../api/days';

/** Today's kind of day (which ratios the dose check uses) and a switch to another kind. */
export function TodayDayKindCard({ profileId, today }: { profileId: number; today: string }) {
  const kinds = useDayKinds(profileId);
  const days = useDayKindDays(profileId, today, today);
  const setDay = useSetDayKindDay(profileId);

  if (kinds.isPending || days.isPending) return <Card><LoadingState label="Loading the kind of day…" /></Card>;
  if (kinds.isError && !kinds.data) return <Card><ErrorState error={kinds.error} onRetry={() => void kinds.refetch()} /></Card>;
  if (days.isError && !days.data) return <Card><ErrorState error={days.error} onRetry={() => void days.refetch()} /></Card>;

  if (kinds.data.length === 0) {
    return (
      <Card aria-label="Kind of day">
        <Text variant="heading">Kind of day</Text>
        <Callout tone="caution" title="No day kinds yet">
          Day kinds hold the insulin-to-carb ratios and correction factors from your diabetes team (for example a rest
          day and a training day). Until one is set up, the dose check cannot suggest a dose.
        </Callout>
        <Link href="/settings" asChild>
          <Button variant="secondary" label="Set up day kinds" />
        </Link>
      </Card>
    );
  }

  const day = days.data[0];
  const current = kinds.data.find((k) => k.id === day?.dayKindId);
  const error = setDay.error instanceof ApiError ? (setDay.error.fieldErrors?.dayKindId?.[0] ?? setDay.error.message) : setDay.error ? 'Today’s kind of day could not be changed. Please try again.' : undefined;
  return (
    <Card aria-label="Kind of day">
      <Text variant="label" color="textMuted">
        Kind of day
      </Text>
      <Text variant="heading" aria-label="Today’s kind of day">
        {current ? current.name : 'None chosen'}
      </Text>
      <Text color="textMuted">
        {current
          ? day?.isSet
            ? 'Chosen for today. The dose check uses its ratios.'
            : 'Your default kind of day. The dose check uses its ratios.'
          : 'No default kind of day is set: choose one for today.'}
      </Text>
      <View style={styles.switch}>
        <ChoiceGroup
          label="Switch today to"
          choices={kinds.data.map((k) => ({ value: k.id, label: k.name }))}
          value={current?.id ?? null}
          onChange={(id) => {
            if (id !== current?.id) setDay.mutate({ date: today, dayKindId: id });
          }}
          error={error}
        />
        {setDay.isPending ? <Text color="textMuted">Saving…</Text> : null}
        {day?.isSet && kinds.data.some((k) => k.isDefault) ? (
          <Button variant="quiet" label="Back to the default kind" disabled={setDay.isPending} onPress={() => setDay.mutate({ date: today, dayKindId: null })} />
        ) : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({ switch: { gap: 8 } });
