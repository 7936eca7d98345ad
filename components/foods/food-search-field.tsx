import { useDeferredValue, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Nutrients } from '../../shared/compute/nutrients';
import { carbInBasis } from '../../shared/compute/nutrients';
import { useActiveProfile } from '../api/auth';
import { useFoodSearch } from '../api/foods';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { showCarb } from '../recipes/recipe-format';

export type PickedFood = { id: number; name: string; per100g: Nutrients };

type Props = {
  onPick: (food: PickedFood) => void;
  /** The field's label; each hit's button reads "<verb> <food name>". */
  label: string;
  verb: string;
  placeholder?: string;
};

/** Finds a food in the tables and pack foods (server-ranked search, shared cache) and hands the chosen one over. */
export function FoodSearchField({ onPick, label, verb, placeholder = 'Search foods, e.g. oats' }: Props) {
  const t = useTheme();
  const { profile } = useActiveProfile();
  const [q, setQ] = useState('');
  const deferred = useDeferredValue(q.trim());
  const search = useFoodSearch({ q: deferred, limit: 8 }, deferred.length >= 2);
  const basis = profile?.carbBasis ?? 'available';
  return (
    <View style={styles.stack}>
      <TextField label={label} value={q} onChangeText={setQ} placeholder={placeholder} autoCapitalize="none" />
      {search.isError ? <Text color="danger">The food search did not answer. Try again.</Text> : null}
      {deferred.length >= 2 && search.data ? (
        <View role="list" aria-label="Matching foods" style={styles.stack}>
          {search.data.items.length === 0 ? <Text color="textMuted">No food matches “{deferred}”.</Text> : null}
          {search.data.items.map((food) => (
            <Pressable
              key={food.id}
              role="button"
              aria-label={`${verb} ${food.name}`}
              onPress={() => {
                onPick({ id: food.id, name: food.name, per100g: food.per100g });
                setQ('');
              }}
              style={({ pressed }) => [styles.hit, { borderColor: t.colors.border, backgroundColor: pressed ? t.colors.surfaceAlt : t.colors.surface }]}
            >
              <View style={styles.grow}>
                <Text>{food.name}</Text>
                <Text variant="caption" color="textMuted">
                  {food.attribution}
                </Text>
              </View>
              <Text variant="caption" color="textMuted">
                {showCarb(carbInBasis(food.per100g, basis), 'g')} / 100 g
              </Text>
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
});
