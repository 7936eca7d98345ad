import { Pressable, StyleSheet, View } from 'react-native';
import type { FoodSummary } from '../../shared/schemas/food';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { BASIS_SHORT, carbText, FIBRE_NOT_MEASURED, fibreNotMeasured, rowCaption } from './food-carb';

type Props = {
  food: FoodSummary;
  basis: CarbBasis;
  unit: CarbUnit;
  favourite: boolean;
  selected?: boolean;
  onPress: () => void;
  onToggleFavourite: () => void;
};

/** One food in a list on one or two lines: name, group (the source is on the food's page), carbohydrate per 100 g in the profile's basis; a star keeps it handy. */
export function FoodRow({ food, basis, unit, favourite, selected, onPress, onToggleFavourite }: Props) {
  const t = useTheme();
  const carb = carbText(food, 100, basis, unit);
  const caption = fibreNotMeasured(food, basis) ? `${FIBRE_NOT_MEASURED} / 100 g` : `${BASIS_SHORT[basis]} / 100 g`;
  return (
    <View style={[styles.row, { borderColor: selected ? t.colors.primary : t.colors.border, backgroundColor: t.colors.surface }]}>
      <Pressable
        role="button"
        aria-label={`${food.name}, ${carb} ${caption.replace('/', 'per')}`}
        onPress={onPress}
        style={({ pressed }) => [styles.main, pressed && { backgroundColor: t.colors.surfaceAlt }]}
      >
        <View style={styles.names}>
          <Text weight="bold" numberOfLines={2}>
            {food.name}
          </Text>
          <Text variant="caption" color="textMuted" numberOfLines={1}>
            {rowCaption(food)}
          </Text>
        </View>
        <View style={styles.carb}>
          <Text variant="lead" weight="bold">
            {carb}
          </Text>
          <Text variant="caption" color="textMuted">
            {caption}
          </Text>
        </View>
      </Pressable>
      <Pressable
        role="button"
        aria-label={favourite ? `Remove ${food.name} from favourites` : `Add ${food.name} to favourites`}
        aria-pressed={favourite}
        onPress={onToggleFavourite}
        style={styles.star}
      >
        <Text variant="heading" color={favourite ? 'primary' : 'textMuted'}>
          {favourite ? '★' : '☆'}
        </Text>
      </Pressable>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'stretch', borderWidth: 1, borderRadius: 12, overflow: 'hidden' },
  main: { flex: 1, flexDirection: 'row', alignItems: 'center', gap: 12, paddingVertical: 10, paddingHorizontal: 14, minHeight: MIN_TOUCH + 12 },
  names: { flex: 1, gap: 2 },
  carb: { alignItems: 'flex-end' },
  star: { width: MIN_TOUCH + 4, alignItems: 'center', justifyContent: 'center' },
});
