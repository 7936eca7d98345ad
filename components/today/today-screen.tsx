import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { authKeys, useActiveProfile, useMe } from '../api/auth';
import { batchKeys } from '../api/batches';
import { dayKeys } from '../api/days';
import { useOfflineCopy } from '../api/offline-copy';
import { planKeys } from '../api/plan';
import { settingsKeys } from '../api/profile-settings';
import { localToday } from '../kitchen/kitchen-format';
import { OfflineNotice } from '../offline/offline-notice';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { TodayDayKindCard } from './today-day-kind';
import { TodayNextMealCard } from './today-next-meal';
import { TodayPortionsCard } from './today-portions';

function todayLabel(now: Date) {
  return now.toLocaleDateString(undefined, { weekday: 'long', day: 'numeric', month: 'long' });
}

/** Today: the day's kind (which ratios apply), a dose check, and the portions waiting in the fridge and freezer; offline, the copy kept on this device. */
export function TodayScreen() {
  const me = useMe();
  const { profile } = useActiveProfile();
  const { isWide } = useLayout();
  const [today] = useState(() => localToday());
  const name = me.data?.user.displayName;
  const pid = profile?.id ?? 0;
  const copy = useOfflineCopy([authKeys.me(), settingsKeys.dayKinds(pid), dayKeys.list(pid, today, today), planKeys.next(pid), batchKeys.list({ profileId: pid, include: 'available' })]);
  return (
    <Screen title={name ? `Good to see you, ${name}` : 'Today'} subtitle={todayLabel(new Date())}>
      <View style={styles.actions}>
        <Link href="/dose-check?log=1" asChild>
          <Button label="Log a meal" size="lg" />
        </Link>
        <Link href="/dose-check" asChild>
          <Button label="Check a dose" size="lg" variant="secondary" />
        </Link>
        <Link href="/logbook/add" asChild>
          <Button variant="secondary" label="Add a reading or dose" size="lg" />
        </Link>
        <Link href="/logbook" asChild>
          <Button variant="secondary" label="Logbook" size="lg" />
        </Link>
      </View>
      {copy.offline && profile ? <OfflineNotice asOf={copy.asOf} timeZone={profile.timeZone} /> : null}
      {me.isPending ? (
        <LoadingState />
      ) : me.isError && !me.data ? (
        <ErrorState error={me.error} onRetry={() => void me.refetch()} />
      ) : profile ? (
        <View style={[styles.columns, isWide && styles.columnsWide]}>
          <View style={[styles.column, isWide && styles.side]}>
            <TodayNextMealCard profileId={profile.id} unit={profile.carbUnit} />
            <TodayDayKindCard profileId={profile.id} today={today} />
          </View>
          <View style={[styles.column, isWide && styles.main]}>
            <TodayPortionsCard profileId={profile.id} unit={profile.carbUnit} today={today} />
          </View>
        </View>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  columns: { gap: 16 },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: 16 },
  side: { flex: 2 },
  main: { flex: 3 },
});
