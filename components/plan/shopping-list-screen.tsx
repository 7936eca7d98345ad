import { Pressable, StyleSheet, View } from 'react-native';
import { useActiveProfile } from '../api/auth';
import { fetchShoppingCsv, useShoppingList, useShoppingTick } from '../api/plan';
import { canPrint, printPage, usePrintStyles } from '../kitchen/print';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { saveFile } from '../ui/save-file';

const hideInPrint = { dataSet: { print: 'hide' } } as object;

/** What to buy for the week's planned cooks: grams per food, grouped, with household measures and ticks. */
export function ShoppingListScreen({ date }: { date: string }) {
  const { profile } = useActiveProfile();
  const list = useShoppingList(profile?.id, date);
  const tick = useShoppingTick(profile?.id);
  const t = useTheme();
  usePrintStyles();
  if (!profile || list.isPending) return <Screen title="Shopping list" backHref="/plan"><LoadingState /></Screen>;
  if (list.isError) return <Screen title="Shopping list" backHref="/plan"><ErrorState error={list.error} onRetry={() => void list.refetch()} /></Screen>;
  const l = list.data;
  const csv = async () => saveFile(await fetchShoppingCsv(profile.id, l.weekStart), `shopping-list-${l.weekStart}.csv`);
  return (
    <Screen title="Shopping list" subtitle={`For the planned cooks of the week of ${l.weekStart}`} backHref="/plan">
      <View style={styles.row} {...hideInPrint}>
        <Button variant="secondary" label="Download CSV" onPress={() => void csv()} />
        {canPrint ? <Button variant="secondary" label="Print" onPress={printPage} /> : null}
      </View>
      {l.cooks.length === 0 ? (
        <EmptyState title="Nothing to buy yet">Plan a cook for this week and its ingredients appear here.</EmptyState>
      ) : (
        <Text color="textMuted">{l.cooks.map((c) => `${c.recipeTitle} (${c.portions} portions, ${c.cookOn})`).join(' · ')}</Text>
      )}
      <Callout tone="info" title="Raw weights">Grams are what the recipes weigh before cooking, scaled to the planned portions. Household measures are approximate.</Callout>
      {l.groups.map((g) => (
        <Card key={g.group} aria-label={g.group}>
          <Text variant="heading">{g.group}</Text>
          {g.lines.map((line) => (
            <Pressable
              key={line.foodId}
              role="checkbox"
              aria-checked={line.ticked}
              aria-label={`${line.foodName}, ${Math.round(line.grams)} g`}
              onPress={() => tick.mutate({ weekStart: l.weekStart, foodId: line.foodId, ticked: !line.ticked })}
              style={[styles.line, { borderColor: t.colors.border }]}
            >
              <Text weight="bold">{line.ticked ? '☑' : '☐'}</Text>
              <View style={styles.text}>
                <Text style={line.ticked ? styles.done : undefined}>
                  {line.foodName}: {Math.round(line.grams)} g{line.measure ? ` (about ${line.measure.count} × ${line.measure.label})` : ''}
                </Text>
                <Text variant="caption" color="textMuted">{line.recipes.join(', ')}</Text>
              </View>
            </Pressable>
          ))}
        </Card>
      ))}
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  line: { flexDirection: 'row', gap: 8, alignItems: 'center', minHeight: MIN_TOUCH, borderTopWidth: StyleSheet.hairlineWidth, paddingVertical: 4 },
  text: { flex: 1 },
  done: { textDecorationLine: 'line-through' },
});
