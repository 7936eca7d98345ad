import { StyleSheet, View } from 'react-native';
import type { ReadingsImportPreview } from '../../shared/schemas/logbook-read';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { glucoseText } from './log-format';

/** The preview's first rows (line, local date and time, value in the profile's unit) and every problem by line. */
export function ImportPreviewRows({ preview }: { preview: ReadingsImportPreview }) {
  const t = useTheme();
  return (
    <View style={styles.wrap}>
      {preview.errors.length ? (
        <View role="alert" style={styles.errors}>
          <Text weight="bold" color="danger">
            {preview.errors.length} {preview.errors.length === 1 ? 'row needs' : 'rows need'} fixing in the file before anything is imported:
          </Text>
          {preview.errors.map((e) => (
            <Text key={e.line} color="danger">
              Line {e.line}: {e.message}
            </Text>
          ))}
        </View>
      ) : null}
      {preview.duplicates ? <Text color="textMuted">{preview.duplicates} readings are already in the logbook and will be skipped.</Text> : null}
      <View role="table" aria-label="First rows">
        <View role="row" style={[styles.tr, { borderColor: t.colors.border }]}>
          {['Line', 'Date', 'Time', 'Glucose', ''].map((h, i) => (
            <Text key={i} role="columnheader" variant="label" style={styles.cell}>
              {h}
            </Text>
          ))}
        </View>
        {preview.firstRows.map((r) => (
          <View key={r.line} role="row" style={[styles.tr, { borderColor: t.colors.border }]}>
            <Text role="cell" style={styles.cell}>
              {r.line}
            </Text>
            <Text role="cell" style={styles.cell}>
              {r.localDate}
            </Text>
            <Text role="cell" style={styles.cell}>
              {r.localTime}
            </Text>
            <Text role="cell" style={styles.cell}>
              {glucoseText(r.glucose, preview.glucoseUnit)}
            </Text>
            <Text role="cell" style={styles.cell} color="textMuted">
              {r.duplicate ? 'already logged' : ''}
            </Text>
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 8 },
  errors: { gap: 2 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, paddingVertical: 4 },
  cell: { flex: 1 },
});
