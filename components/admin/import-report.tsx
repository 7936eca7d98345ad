import { StyleSheet, View } from 'react-native';
import type { DatasetImport } from '../../shared/schemas/food';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';

const DATASET_WORDS = { ifct2017: 'IFCT 2017', usda_fdc: 'USDA FoodData Central', usda_sr28: 'USDA SR28' } as const;
const STATUS_WORDS = { running: 'Running', succeeded: 'Finished', failed: 'Failed — nothing was changed', previewed: 'Preview — nothing was changed' } as const;

type Skip = { reason: string; count: number; examples: string[] };
type Diff = { added: { count: number }; changed: { count: number }; emptied: { count: number } };

/** One import: progress while it runs, then counts, skipped rows with reasons, or the file error. */
export function ImportReport({ item }: { item: DatasetImport }) {
  const skipped = ((item.report as { skipped?: Skip[] }).skipped ?? []) as Skip[];
  const diff = (item.report as { diff?: Diff }).diff;
  return (
    <Card>
      <Text variant="heading">
        {DATASET_WORDS[item.dataset]} · #{item.id}
      </Text>
      <Text weight="bold" role="status">
        {STATUS_WORDS[item.status]}
        {item.status === 'running' && item.stage ? ` — ${item.stage}, ${item.rowsRead.toLocaleString()} rows read` : ''}
      </Text>
      <Text color="textMuted">{item.version}</Text>
      {item.status === 'succeeded' ? (
        <View style={styles.counts}>
          <Text>{item.rowsInserted} new</Text>
          <Text>{item.rowsUpdated} updated</Text>
          <Text>{item.rowsUnchanged} unchanged</Text>
          <Text>{item.rowsSkipped} rows skipped</Text>
          <Text color="textMuted">{item.rowsRead.toLocaleString()} rows read in {((item.durationMs ?? 0) / 1000).toFixed(1)} s</Text>
        </View>
      ) : null}
      {diff ? (
        <Text>
          Would add {diff.added.count}, change {diff.changed.count}, empty {diff.emptied.count}
        </Text>
      ) : null}
      {skipped.map((s) => (
        <Text key={s.reason} variant="caption" color="textMuted">
          Skipped {s.count}: {s.reason} (e.g. {s.examples.join('; ')})
        </Text>
      ))}
      {item.status === 'failed' && item.error ? (
        <Callout tone="danger" title="The files were not imported">
          {item.error}
        </Callout>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({ counts: { flexDirection: 'row', flexWrap: 'wrap', gap: 16 } });
