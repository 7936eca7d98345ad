import { Link, router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Food } from '../../shared/schemas/food';
import { useActiveProfile } from '../api/auth';
import { useLayout } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { EmptyState } from '../ui/states';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { FoodDetail } from './food-detail';
import { FoodPicker } from './food-picker';

export const DEFAULT_TABLE_CREDIT =
  'Default food table: Indian Food Composition Tables 2017, National Institute of Nutrition (ICMR), Hyderabad. USDA tables, where imported: U.S. Department of Agriculture, Agricultural Research Service (public domain).';

/** The food table: search on the left; on a wide screen the chosen food opens beside the list. */
export function FoodSearchScreen() {
  const { isWide } = useLayout();
  const { profile } = useActiveProfile();
  const [chosen, setChosen] = useState<Food | null>(null);
  const onPick = (food: Food) => (isWide ? setChosen(food) : router.push(`/foods/${food.id}`));
  const addLabel = (
    <Link href="/foods/new" asChild>
      <Button variant="secondary" label="Add a pack food" />
    </Link>
  );
  const credit = (
    <Text variant="caption" color="textMuted">
      {DEFAULT_TABLE_CREDIT}
    </Text>
  );
  if (!isWide) {
    return (
      <Screen title="Food table" subtitle="Carbohydrate per 100 g, from open tables and your own labels" backHref="/more" actions={addLabel}>
        <FoodPicker onPick={onPick} autoFocus />
        {credit}
      </Screen>
    );
  }
  return (
    <Screen title="Food table" subtitle="Carbohydrate per 100 g, from open tables and your own labels" backHref="/more" actions={addLabel}>
      <View style={styles.panes}>
        <View style={styles.list}>
          <FoodPicker onPick={onPick} selectedId={chosen?.id} autoFocus />
          {credit}
        </View>
        <View style={styles.detail}>
          {chosen ? (
            <>
              <Card>
                <Text variant="title">{chosen.name}</Text>
                <Link href={`/foods/${chosen.id}`} asChild>
                  <Button variant="quiet" label="Open on its own page" />
                </Link>
              </Card>
              <FoodDetail food={chosen} basis={profile?.carbBasis ?? 'available'} unit={profile?.carbUnit ?? 'g'} />
            </>
          ) : (
            <EmptyState title="Pick a food">Its values per 100 g and per household measure, with the source and licence, show here.</EmptyState>
          )}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  panes: { flexDirection: 'row', gap: 24, alignItems: 'flex-start' },
  list: { flex: 5, gap: 12 },
  detail: { flex: 6, gap: 16 },
});
