import { StyleSheet, View } from 'react-native';
import { LOG_KIND_WORDS, type LogHistoryPage, type LogHistoryRow } from '../../shared/schemas/logbook-read';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { EntryCorrections } from './entry-corrections';
import { dayText } from '../ui/date-format';
import { entrySummary, glucoseText, unitsText } from './log-format';

type Units = Pick<LogHistoryPage, 'glucoseUnit' | 'carbBasis' | 'carbUnit'>;

function mealCells(row: LogHistoryRow, u: Units) {
  const c = row.mealContext;
  return {
    before: c?.readingBefore ? `${glucoseText(c.readingBefore.glucose, u.glucoseUnit)} at ${c.readingBefore.localTime}` : '—',
    suggested: unitsText(c?.suggestedUnits ?? null),
    taken: unitsText(c?.takenUnits ?? null),
  };
}

const COLUMNS = [
  { key: 'when', label: 'When', flex: 1.2 },
  { key: 'type', label: 'Entry', flex: 1.1 },
  { key: 'what', label: 'What', flex: 2.2 },
  { key: 'before', label: 'Reading before', flex: 1.3 },
  { key: 'suggested', label: 'Suggested', flex: 1 },
  { key: 'taken', label: 'Taken', flex: 1 },
] as const;

/** The history as a table (wide screens): one row per entry; meal rows carry the reading before and both doses. */
export function HistoryTable({ profileId, rows, units }: { profileId: number; rows: LogHistoryRow[]; units: Units }) {
  const t = useTheme();
  return (
    <Card style={styles.tableCard}>
      <View role="table" aria-label="Logbook history">
        <View role="row" style={[styles.tr, styles.head, { borderColor: t.colors.border }]}>
          {COLUMNS.map((c) => (
            <Text key={c.key} role="columnheader" variant="label" style={[styles.cell, { flex: c.flex }]}>
              {c.label}
            </Text>
          ))}
        </View>
        {rows.map((row) => {
          const meal = row.meal ? mealCells(row, units) : null;
          const cells = {
            when: `${dayText(row.localDate)} ${row.localTime}`,
            type: LOG_KIND_WORDS[row.kind],
            what: `${entrySummary(row, units.glucoseUnit, units.carbBasis, units.carbUnit)}${row.dayKindName ? ` · ${row.dayKindName}` : ''}${row.changed ? ' · changed' : ''}`,
            before: meal?.before ?? '',
            suggested: meal?.suggested ?? '',
            taken: meal?.taken ?? '',
          };
          return (
            <View key={row.id} role="rowgroup" style={[styles.rowGroup, { borderColor: t.colors.border }]}>
              <View role="row" style={styles.tr}>
                {COLUMNS.map((c) => (
                  <Text key={c.key} role="cell" style={[styles.cell, { flex: c.flex }]} weight={c.key === 'what' && row.meal ? 'bold' : 'regular'}>
                    {cells[c.key]}
                  </Text>
                ))}
              </View>
              <EntryCorrections profileId={profileId} entry={row} units={units} />
            </View>
          );
        })}
      </View>
    </Card>
  );
}

/** The history as cards (phones): one card per entry, meal cards with the reading before and both doses. */
export function HistoryCards({ profileId, rows, units }: { profileId: number; rows: LogHistoryRow[]; units: Units }) {
  return (
    <View role="list" aria-label="Logbook history" style={styles.cards}>
      {rows.map((row) => {
        const meal = row.meal ? mealCells(row, units) : null;
        return (
          <Card key={row.id} role="listitem">
            <Text color="textMuted">
              {dayText(row.localDate)} {row.localTime} · {LOG_KIND_WORDS[row.kind]}
              {row.dayKindName ? ` · ${row.dayKindName}` : ''}
              {row.changed ? ' · changed' : ''}
            </Text>
            <Text weight="bold">{entrySummary(row, units.glucoseUnit, units.carbBasis, units.carbUnit)}</Text>
            {meal ? (
              <Text>
                Reading before: {meal.before} · Suggested: {meal.suggested} · Taken: {meal.taken}
              </Text>
            ) : null}
            <EntryCorrections profileId={profileId} entry={row} units={units} />
          </Card>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  tableCard: { padding: 8 },
  tr: { flexDirection: 'row', paddingVertical: 8, gap: 8 },
  head: { borderBottomWidth: 2 },
  rowGroup: { borderBottomWidth: 1, paddingBottom: 4 },
  cell: { paddingHorizontal: 4 },
  cards: { gap: 10 },
});
