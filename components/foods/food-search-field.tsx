import { useDeferredValue, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Nutrients } from '../../shared/compute/nutrients';
import type { FoodSummary } from '../../shared/schemas/food';
import { useActiveProfile } from '../api/auth';
import { useFoodSearch } from '../api/foods';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { AddPackFoodInline } from './add-pack-food-inline';
import { carbText, FIBRE_NOT_MEASURED, fibreNotMeasured, rowCaption } from './food-carb';

export type PickedFood = { id: number; name: string; per100g: Nutrients };

type Props = {
  onPick: (food: PickedFood) => void;
  /** The field's label; each hit's button reads "<verb> <food name>". */
  label: string;
  verb: string;
  placeholder?: string;
};

/**
 * Finds a food in the tables and pack foods (server-ranked search, shared cache) and hands the chosen one over. When
 * nothing matches, a pack food can be added from its label right here and is handed over as if picked.
 */
export function FoodSearchField({ onPick, label, verb, placeholder = 'Search foods, e.g. oats' }: Props) {
  const t = useTheme();
  const { profile } = useActiveProfile();
  const [q, setQ] = useState('');
  const [adding, setAdding] = useState<string | null>(null);
  const deferred = useDeferredValue(q.trim());
  const search = useFoodSearch({ q: deferred, limit: 8 }, deferred.length >= 2 && adding == null);
  const basis = profile?.carbBasis ?? 'available';
  const unit = profile?.carbUnit ?? 'g';
  const pick = (food: PickedFood) => {
    onPick({ id: food.id, name: food.name, per100g: food.per100g });
    setQ('');
    setAdding(null);
  };
  if (adding != null) return <AddPackFoodInline name={adding} onAdded={pick} onCancel={() => setAdding(null)} />;
  return (
    <View style={styles.stack}>
      <TextField label={label} value={q} onChangeText={setQ} placeholder={placeholder} autoCapitalize="none" />
      {search.isError ? <Text color="danger">The food search did not answer. Try again.</Text> : null}
      {deferred.length >= 2 && search.data ? (
        <View role="list" aria-label="Matching foods" style={styles.stack}>
          {search.data.items.length === 0 ? (
            <View style={styles.stack}>
              <Text color="textMuted">No food matches “{deferred}”.</Text>
              <Button variant="secondary" label="Add a pack food" onPress={() => setAdding(deferred)} />
            </View>
          ) : null}
          {search.data.items.map((food: FoodSummary) => (
            <Pressable
              key={food.id}
              role="button"
              aria-label={`${verb} ${food.name}`}
              onPress={() => pick(food)}
              style={({ pressed }) => [styles.hit, { borderColor: t.colors.border, backgroundColor: pressed ? t.colors.surfaceAlt : t.colors.surface }]}
            >
              <View style={styles.grow}>
                <Text numberOfLines={2}>{food.name}</Text>
                <Text variant="caption" color="textMuted" numberOfLines={1}>
                  {rowCaption(food)}
                </Text>
              </View>
              <View style={styles.carb}>
                <Text weight="bold">{carbText(food, 100, basis, unit)}</Text>
                <Text variant="caption" color="textMuted">
                  {fibreNotMeasured(food, basis) ? `${FIBRE_NOT_MEASURED} / 100 g` : 'per 100 g'}
                </Text>
              </View>
            </Pressable>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 8 },
  hit: { flexDirection: 'row', alignItems: 'center', gap: 8, padding: 12, borderWidth: 1, borderRadius: 10, minHeight: 44 },
  grow: { flex: 1, minWidth: 0 },
  carb: { alignItems: 'flex-end' },
});
