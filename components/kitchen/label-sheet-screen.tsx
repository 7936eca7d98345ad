import { router } from 'expo-router';
import { Image, StyleSheet, View } from 'react-native';
import type { PortionLabel } from '../../shared/schemas/portion';
import { CARB_UNIT_LABEL } from '../../shared/compute/units';
import { useActiveProfile } from '../api/auth';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { dateWord } from './kitchen-format';
import { dayText } from '../ui/date-format';
import { useLabelSheet } from '../api/batches';
import { canPrint, printPage, usePrintStyles } from './print';

const hideInPrint = { dataSet: { print: 'hide' } } as object;
const keepTogether = { dataSet: { print: 'label' } } as object;

/** The printable label sheet of a batch: one label per portion, with a QR code to its page. */
export function LabelSheetScreen({ id }: { id: number }) {
  usePrintStyles();
  const { profile } = useActiveProfile();
  const sheet = useLabelSheet(profile?.id, id);
  if (sheet.isPending || !profile) return <LoadingState />;
  if (sheet.isError) return <ErrorState error={sheet.error} onRetry={sheet.refetch} />;
  const s = sheet.data;
  const unitName = s.unit === 'g' ? 'grams' : CARB_UNIT_LABEL[s.unit].long;
  return (
    <Screen>
      <View style={styles.head} {...hideInPrint}>
        <Button variant="quiet" label="‹ Back to the batch" onPress={() => (router.canGoBack() ? router.back() : router.replace(`/kitchen/batches/${id}`))} />
        <Text variant="title" aria-level={1}>
          Labels: {s.recipeTitle}
        </Text>
        <Text color="textMuted">
          {s.labels.length} labels. Carbohydrate is {s.basis === 'available' ? 'available (fibre not counted)' : 'total (fibre counted)'}, in {unitName}
          . Grams of 10 and over are rounded to whole grams, under 10 g to 0.1 g.
        </Text>
        {canPrint ? <Button label="Print labels" onPress={printPage} /> : null}
      </View>
      <View style={styles.grid} role="list" aria-label="Labels">
        {s.labels.map((label) => (
          <LabelCard key={label.code} label={label} personName={s.personName} />
        ))}
      </View>
    </Screen>
  );
}

function LabelCard({ label, personName }: { label: PortionLabel; personName: string | null }) {
  const t = useTheme();
  return (
    <View role="listitem" aria-label={`Label ${label.displayCode}`} style={[styles.label, { borderColor: t.colors.text, backgroundColor: t.colors.surface }]} {...keepTogether}>
      <View style={styles.text}>
        <Text variant="heading" numberOfLines={2}>
          {label.recipeTitle}
        </Text>
        {personName ? <Text weight="bold">For {personName}</Text> : null}
        <Text variant="caption">
          Cooked {dayText(label.cookedOn)} · {dateWord(label.storage)} {dayText(label.useBy)} ({label.storage})
        </Text>
        <Text variant="lead" weight="bold">
          {label.text.carbLine}
        </Text>
        <Text variant="caption">
          Net {label.text.net} · {label.text.carbPer100g} per 100 g
        </Text>
        <Text variant="heading" style={styles.code}>
          {label.displayCode}
        </Text>
        {label.status !== 'available' ? <Text variant="caption">({label.status === 'eaten' ? 'eaten' : 'thrown away'})</Text> : null}
      </View>
      <Image source={{ uri: label.qrDataUrl }} style={styles.qr} accessibilityLabel={`QR code for ${label.url}`} />
    </View>
  );
}

const styles = StyleSheet.create({
  head: { gap: 8 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 10 },
  label: { width: 340, maxWidth: '100%', flexDirection: 'row', borderWidth: 1, borderRadius: 8, padding: 10, gap: 8, alignItems: 'center' },
  text: { flex: 1, gap: 2 },
  code: { letterSpacing: 2, fontVariant: ['tabular-nums'] },
  qr: { width: 132, height: 132 },
});
