import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useActiveProfile } from '../api/auth';
import { useDayKinds, useProfileSettings } from '../api/profile-settings';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

/** Settings: where units and safety limits, day kinds and the change history live. */
export function SettingsHomeScreen() {
  const { profile, isPending: mePending } = useActiveProfile();
  const settings = useProfileSettings(profile?.id);
  const dayKinds = useDayKinds(profile?.id);
  if (mePending || settings.isPending || dayKinds.isPending) return <LoadingState />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => void settings.refetch()} />;
  if (dayKinds.isError) return <ErrorState error={dayKinds.error} onRetry={() => void dayKinds.refetch()} />;
  const ready = !!settings.data.settings && dayKinds.data.length > 0;
  return (
    <Screen title="Settings" subtitle={profile ? `For ${profile.displayName}` : undefined} backHref="/more">
      {ready ? (
        <Callout tone="ok" title="Dose checks are ready">
          Units, safety limits and at least one day kind are set. Change them only as your diabetes team advises.
        </Callout>
      ) : (
        <Callout tone="caution" title="Not set up yet">
          No dose can be suggested until both the units and safety limits and at least one day kind with its ratios are
          filled in. Use the numbers your diabetes team gave you.
        </Callout>
      )}
      <Card>
        <Text variant="heading">Units and safety limits</Text>
        <Text color="textMuted">
          {settings.data.settings ? 'Set.' : 'Not set yet.'} Glucose and carbohydrate units, pen steps, maximum dose,
          action time, targets and the exercise table.
        </Text>
        <View style={styles.actions}>
          <Link href="/settings/units" asChild>
            <Button label="Units and safety limits" variant="secondary" />
          </Link>
        </View>
      </Card>
      <Card>
        <Text variant="heading">Day kinds and ratios</Text>
        <Text color="textMuted">
          {dayKinds.data.length ? dayKinds.data.map((k) => k.name).join(', ') : 'None yet.'} Each kind of day holds its
          insulin-to-carb ratios and correction factors by time of day.
        </Text>
        <View style={styles.actions}>
          <Link href="/settings/day-kinds" asChild>
            <Button label="Day kinds and ratios" variant="secondary" />
          </Link>
        </View>
      </Card>
      <Card>
        <Text variant="heading">Change history</Text>
        <Text color="textMuted">Who changed what, and when, with the old and new values.</Text>
        <View style={styles.actions}>
          <Link href="/settings/history" asChild>
            <Button label="Change history" variant="secondary" />
          </Link>
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({ actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 } });
