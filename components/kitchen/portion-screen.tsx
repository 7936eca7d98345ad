import { router } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { formatCarb } from '../../shared/compute/units';
import { Figure } from './cooked-weight-step';
import { dateWord, gramsText, localToday, shelfStatus } from './kitchen-format';
import { dateTimeText, dayText } from '../ui/date-format';
import { usePortion, useSetPortionStatus } from '../api/portions';
import { doseCheckHref } from '../dose/dose-href';

/** How long the portion page offers to undo "Thrown away" (ms); the batch page can always undo. Eating is logged (with its own undo). */
export const UNDO_MS = 10_000;

/** The page a label's QR code opens: the portion's numbers, its dates, and what to do with it. */
export function PortionScreen({ code }: { code: string }) {
  const portion = usePortion(code);
  const mark = useSetPortionStatus();
  const [undoable, setUndoable] = useState(false);
  useEffect(() => {
    if (!undoable) return;
    const timer = setTimeout(() => setUndoable(false), UNDO_MS);
    return () => clearTimeout(timer);
  }, [undoable]);
  const markAs = (status: 'discarded' | 'available') =>
    mark.mutate({ code: portion.data!.code, status }, { onSuccess: () => setUndoable(status !== 'available') });
  if (portion.isPending) return <LoadingState />;
  if (portion.isError) return <ErrorState error={portion.error} onRetry={portion.refetch} />;
  const p = portion.data;
  const shelf = shelfStatus(p.useBy, localToday(), p.storage);
  const doseHref = doseCheckHref({ code: p.code, carbGrams: p.carb.grams, label: p.recipeTitle });
  return (
    <Screen title={p.recipeTitle} subtitle={`Portion ${formatPortionCode(p.code)} · ${p.profileName}`} backHref="/kitchen">
      <Card>
        <View style={styles.numbers}>
          <View>
            <Text variant="label" color="textMuted">
              Carbohydrate in this portion
            </Text>
            <Text variant="number">{formatCarb(p.carb.grams, p.unit, { withGrams: true })}</Text>
          </View>
          <Figure label="Net weight" value={gramsText(p.netGrams)} />
          <Figure label="Per 100 g" value={formatCarb(p.carbPer100g.grams, p.unit, { withGrams: true })} />
        </View>
        <Text color="textMuted">
          Counted as {p.basis === 'available' ? 'available carbohydrate (fibre not counted)' : 'total carbohydrate (fibre counted)'}.
          {p.containerName ? ` In ${p.containerName}.` : ''}
        </Text>
        <Text>
          Cooked {dayText(p.cookedOn)} · {dateWord(p.storage)} {dayText(p.useBy)} · {p.storage}
        </Text>
      </Card>
      {p.status !== 'available' ? (
        <Callout tone="info" title={p.status === 'eaten' ? 'Already eaten' : 'Thrown away'}>
          {`Marked ${p.status === 'eaten' ? 'eaten' : 'thrown away'}${p.statusChangedAt ? ` on ${dateTimeText(p.statusChangedAt)}` : ''}.`}
          {undoable ? <Button variant="secondary" label="Undo" loading={mark.isPending} onPress={() => markAs('available')} /> : null}
        </Callout>
      ) : shelf.tone === 'danger' ? (
        <Callout tone="danger" title="Past use-by">
          {`${shelf.text}. Food-safety advice is not to eat it.`}
        </Callout>
      ) : (
        <Text variant="label" color={shelf.tone === 'ok' ? 'inRange' : 'caution'}>
          {shelf.tone === 'ok' ? '✓ ' : '! '}
          {shelf.text}
        </Text>
      )}
      {mark.isError ? <Callout tone="danger">{mark.error.message}</Callout> : null}
      {p.status === 'available' ? (
        <Card>
          {shelf.tone === 'danger' ? null : (
            <>
              <Button size="lg" label="Check a dose for this" onPress={() => router.push(doseHref)} />
              <Text variant="caption" color="textMuted">
                A dose check is a calculation from your own settings, not medical advice; your diabetes team sets the ratios.
              </Text>
            </>
          )}
          <View style={styles.row}>
            {shelf.tone === 'danger' ? null : <Button variant="secondary" label="Log this meal" onPress={() => router.push(doseCheckHref({ code: p.code, carbGrams: p.carb.grams, label: p.recipeTitle }, true))} />}
            <Button variant="danger" label="Thrown away" loading={mark.isPending} onPress={() => markAs('discarded')} />
          </View>
        </Card>
      ) : null}
      {p.recipeId ? <Button variant="quiet" label="Open the batch" onPress={() => router.push(`/kitchen/batches/${p.batchId}`)} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  numbers: { flexDirection: 'row', flexWrap: 'wrap', gap: 24, alignItems: 'flex-end' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
