import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { normalizePortionCode } from '../../shared/compute/portion-code';
import { authKeys, useActiveProfile } from '../api/auth';
import { batchKeys } from '../api/batches';
import { containerKeys } from '../api/containers';
import { useOfflineCopy } from '../api/offline-copy';
import { OfflineNotice } from '../offline/offline-notice';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { BatchCard } from './batch-card';
import { ContainersPanel } from './containers-panel';
import { localToday } from './kitchen-format';
import { useBatches } from '../api/batches';

/** The kitchen: what is in the fridge and freezer by batch, cooking a new batch, and the saved containers; offline, the copy kept on this device. */
export function KitchenScreen() {
  const { profile } = useActiveProfile();
  const batches = useBatches(profile?.id, 'all');
  const { isWide } = useLayout();
  const [show, setShow] = useState<'available' | 'all'>('available');
  const [code, setCode] = useState('');
  const [codeError, setCodeError] = useState<string>();
  const today = localToday();
  const pid = profile?.id ?? 0;
  const copy = useOfflineCopy([authKeys.me(), batchKeys.list({ profileId: pid, include: 'all' }), containerKeys.list(pid)]);

  const openCode = () => {
    const normal = normalizePortionCode(code);
    if (!normal) return setCodeError('A portion code has 6 letters and digits, like K7M-Q4P.');
    setCodeError(undefined);
    router.push(`/portions/${normal}`);
  };

  const shown = (batches.data ?? []).filter((b) => show === 'all' || b.counts.available > 0);
  const inventory = batches.isPending ? (
    <LoadingState />
  ) : batches.isError && !batches.data ? (
    <ErrorState error={batches.error} onRetry={batches.refetch} />
  ) : shown.length === 0 ? (
    <EmptyState title={show === 'all' ? 'No batches cooked yet' : 'Nothing in the fridge or freezer'}>
      Cooking a batch walks you through weighing each ingredient and the cooked pot, then portions it out into containers with
      their carbohydrate and a label.
    </EmptyState>
  ) : (
    shown.map((b) => <BatchCard key={b.id} batch={b} today={today} />)
  );

  return (
    <Screen
      title="Kitchen"
      subtitle="Cook a batch by weight and portion it out with labels."
      actions={<Button label="Cook a batch" size="lg" onPress={() => router.push('/kitchen/batches/new')} />}
    >
      {copy.offline && profile ? <OfflineNotice asOf={copy.asOf} timeZone={profile.timeZone} /> : null}
      <View style={isWide ? styles.columns : styles.stack}>
        <View style={[styles.stack, isWide && styles.main]}>
          <View style={styles.row}>
            <Text variant="heading" style={styles.grow}>
              Fridge and freezer
            </Text>
            <Button
              variant="quiet"
              label={show === 'available' ? 'Show eaten batches too' : 'Only what is left'}
              onPress={() => setShow(show === 'available' ? 'all' : 'available')}
            />
          </View>
          {inventory}
        </View>
        <View style={[styles.stack, isWide && styles.side]}>
          <Card>
            <Text variant="heading">Find a portion</Text>
            <TextField
              label="Code on the label"
              value={code}
              onChangeText={setCode}
              autoCapitalize="characters"
              error={codeError}
              onSubmitEditing={openCode}
              placeholder="K7M-Q4P"
            />
            <Button variant="secondary" label="Open portion" onPress={openCode} />
          </Card>
          {profile ? <ContainersPanel profileId={profile.id} /> : null}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', gap: 24, alignItems: 'flex-start' },
  stack: { gap: 16 },
  main: { flex: 3 },
  side: { flex: 2 },
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  grow: { flex: 1 },
});
