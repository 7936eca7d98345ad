import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { toLocalTime } from '../../shared/compute/local-time';
import type { LogEntry, LogEntryChange } from '../../shared/schemas/logbook';
import { LOG_KIND_WORDS, type LogHistoryPage } from '../../shared/schemas/logbook-read';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import { useProfileCan } from '../api/auth';
import { useDeleteLogEntry, useLogEntryChanges } from '../api/logbook';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { EditEntryForm } from './edit-entry-form';
import { dayText } from '../ui/date-format';
import { entrySummary } from './log-format';

type Units = Pick<LogHistoryPage, 'glucoseUnit' | 'carbBasis' | 'carbUnit'>;
const ACTION_WORDS: Record<LogEntryChange['action'], string> = { edit: 'Edited', delete: 'Deleted', restore: 'Restored' };

/** An entry as it was, in a line: its local time and what it held. */
const versionText = (e: LogEntry, u: Units) => `${e.localTime} · ${entrySummary({ ...e, mealContext: null }, u.glucoseUnit, u.carbBasis, u.carbUnit)}${e.note ? ` · ${e.note}` : ''}`;

/** One correction: who, when (in the entry's zone), before → after. */
export function changeText(change: LogEntryChange, units: Units): string {
  const at = toLocalTime(Date.parse(change.changedAt), change.before.timeZone);
  const who = change.changedBy?.name ?? 'someone';
  const after = change.after ? versionText(change.after, units) : 'deleted';
  return `${ACTION_WORDS[change.action]} by ${who}, ${dayText(at.localDate)} ${minutesToTime(at.localMinute)}: ${versionText(change.before, units)} → ${after}`;
}

/** An entry's corrections, fetched when shown. */
export function EntryChanges({ profileId, entryId, units }: { profileId: number; entryId: number; units: Units }) {
  const changes = useLogEntryChanges(profileId, entryId);
  if (changes.isPending) return <LoadingState label="Loading changes…" />;
  if (changes.isError) return <ErrorState error={changes.error} onRetry={() => void changes.refetch()} />;
  return (
    <View role="list" aria-label="Changes to this entry" style={styles.list}>
      {changes.data.length === 0 ? <Text color="textMuted">No changes recorded.</Text> : null}
      {changes.data.map((c) => (
        <Text key={c.id} role="listitem">
          {changeText(c, units)}
        </Text>
      ))}
    </View>
  );
}

type Mode = 'idle' | 'edit' | 'delete' | 'changes';

/** Edit, Delete (with a confirm step) and, for a changed entry, its history — under one History row or card. */
export function EntryCorrections({ profileId, entry, units }: { profileId: number; entry: LogEntry; units: Units }) {
  const [mode, setMode] = useState<Mode>('idle');
  const remove = useDeleteLogEntry(profileId);
  const toggle = (m: Mode) => setMode(mode === m ? 'idle' : m);
  const canWrite = useProfileCan('log.write');
  const which = `${LOG_KIND_WORDS[entry.kind].toLowerCase()} of ${dayText(entry.localDate)} ${entry.localTime}`;
  if (!canWrite && !entry.changed) return null;
  return (
    <View style={styles.wrap}>
      <View style={styles.row}>
        {canWrite ? (
          <>
            <Button variant="quiet" label="Edit" aria-label={`Edit ${which}`} onPress={() => toggle('edit')} />
            <Button variant="quiet" label="Delete" aria-label={`Delete ${which}`} onPress={() => toggle('delete')} />
          </>
        ) : null}
        {entry.changed ? (
          <Button variant="quiet" label={mode === 'changes' ? 'Hide changes' : 'Show changes'} aria-label={`Changes to ${which}`} onPress={() => toggle('changes')} />
        ) : null}
      </View>
      {mode === 'edit' ? <EditEntryForm profileId={profileId} entry={entry} glucoseUnit={units.glucoseUnit} carbBasis={units.carbBasis} onDone={() => setMode('idle')} /> : null}
      {mode === 'delete' ? (
        <Callout tone="caution" title="Delete this entry?">
          <Text>It leaves the history and the charts; the old version is kept in its changes.{entry.meal?.portionCode ? ' The portion goes back to not eaten.' : ''}</Text>
          {remove.isError ? <Text color="danger">{remove.error.message}</Text> : null}
          <View style={styles.row}>
            <Button variant="danger" label="Yes, delete" loading={remove.isPending} onPress={() => remove.mutate(entry.id, { onSuccess: () => setMode('idle') })} />
            <Button variant="quiet" label="Keep it" onPress={() => setMode('idle')} />
          </View>
        </Callout>
      ) : null}
      {mode === 'changes' ? <EntryChanges profileId={profileId} entryId={entry.id} units={units} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 8 },
  row: { flexDirection: 'row', gap: 8, flexWrap: 'wrap', alignItems: 'center' },
  list: { gap: 4 },
});
