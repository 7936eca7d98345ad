import { Image, StyleSheet, View } from 'react-native';
import { NUTRIENT_KEYS, type NutrientKey } from '../../shared/compute/nutrients';
import { UNKNOWN } from '../../shared/compute/units';
import { FOOD_SOURCE_LABELS, type Food } from '../../shared/schemas/food';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { useFoodPhoto } from '../api/foods';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { BASIS_WORDS, carbText, fibreNotMeasured } from './food-carb';

const NUTRIENT_LABELS: Record<NutrientKey, string> = {
  energyKcal: 'Energy (kcal)',
  energyKj: 'Energy (kJ)',
  carbAvailable: 'Available carbohydrate (fibre not included)',
  carbTotal: 'Total carbohydrate (fibre included)',
  fibre: 'Fibre',
  sugars: 'Sugars',
  protein: 'Protein',
  fat: 'Fat',
  water: 'Water',
};

function valueText(key: NutrientKey, v: number | null): string {
  if (v == null) return UNKNOWN;
  if (key === 'energyKcal') return `${Math.round(v)} kcal`;
  if (key === 'energyKj') return `${Math.round(v)} kJ`;
  return `${(Math.round(v * 100) / 100).toString()} g`;
}

/** Everything known about one food: carbohydrate in the profile's basis, per 100 g and per household measure, source and licence. */
export function FoodDetail({ food, basis, unit }: { food: Food; basis: CarbBasis; unit: CarbUnit }) {
  const photo = useFoodPhoto(food.id, food.hasPhoto);
  const measuredKey: NutrientKey | null = food.carbMeasured === 'available' ? 'carbAvailable' : food.carbMeasured === 'total' ? 'carbTotal' : null;
  return (
    <View style={styles.wrap}>
      <Card>
        <Text variant="label" color="textMuted">
          Carbohydrate per 100 g, counted as {BASIS_WORDS[basis]}
        </Text>
        <Text variant="number" aria-label={`${carbText(food, 100, basis, unit)} per 100 g`}>
          {carbText(food, 100, basis, unit)}
        </Text>
        {food.carbNote ? <Text color="textMuted">{food.carbNote}</Text> : null}
        {food.carbStarchSugars != null ? (
          <Text variant="caption" color="textMuted">
            The table also gives measured starch + sugars: {food.carbStarchSugars} g per 100 g (not the counted value).
          </Text>
        ) : null}
      </Card>
      {fibreNotMeasured(food, basis) ? (
        <Callout tone="caution" title="Fibre not measured">
          The table gives total carbohydrate (fibre included) but no fibre value, so the available carbohydrate is unknown.
          The numbers here are the total, which may count some fibre as carbohydrate. You can still use the food knowingly; a
          recipe using it will say its available total is incomplete.
        </Callout>
      ) : null}
      {carbText(food, 100, basis, unit) === UNKNOWN ? (
        <Callout tone="caution" title="Carbohydrate unknown">
          The source does not give enough to count this food&apos;s carbohydrate in your basis. A recipe using it will say its
          total is incomplete.
        </Callout>
      ) : null}

      <Card>
        <Text variant="heading">Household measures</Text>
        {food.measures.length === 0 ? (
          <Text color="textMuted">The source gives no household measures for this food; weigh it in grams.</Text>
        ) : (
          food.measures.map((m, i) => (
            <View key={`${m.label}-${i}`} style={styles.line}>
              <Text style={styles.flex}>
                {m.label} <Text color="textMuted">({Math.round(m.grams * 10) / 10} g)</Text>
              </Text>
              <Text weight="bold">{carbText(food, m.grams, basis, unit)}</Text>
            </View>
          ))
        )}
      </Card>

      <Card>
        <Text variant="heading">Per 100 g</Text>
        {NUTRIENT_KEYS.map((k) => (
          <View key={k} style={styles.line}>
            <Text style={styles.flex}>
              {NUTRIENT_LABELS[k]}
              {k === measuredKey ? <Text color="textMuted"> · as published</Text> : null}
              {food.derived.includes(k) ? <Text color="textMuted"> · worked out here</Text> : null}
            </Text>
            <Text weight="bold">{valueText(k, food.per100g[k])}</Text>
          </View>
        ))}
        <Text variant="caption" color="textMuted">
          “Not known” means the source has no value; it is never counted as 0.
        </Text>
      </Card>

      {photo.data ? (
        <Card>
          <Text variant="heading">Label photo</Text>
          <Image source={{ uri: photo.data }} style={styles.photo} resizeMode="contain" accessibilityLabel={`Label of ${food.name}`} />
        </Card>
      ) : null}

      <Card>
        <Text variant="heading">Source</Text>
        <Text>
          {FOOD_SOURCE_LABELS[food.source]}
          {food.source !== 'pack' ? `, food code ${food.sourceCode}` : ''}
          {food.ndbNumber && food.source === 'usda_fdc' ? ` (NDB ${food.ndbNumber})` : ''}
        </Text>
        {food.group ? <Text color="textMuted">Group: {food.group}</Text> : null}
        {food.scientificName ? <Text color="textMuted">Scientific name: {food.scientificName}</Text> : null}
        {food.altNames.length ? <Text color="textMuted">Also called: {food.altNames.slice(0, 12).join(', ')}</Text> : null}
        <Text variant="caption" color="textMuted">
          {food.attribution}
        </Text>
        <Text variant="caption" color="textMuted">
          Licence: {food.licence}
        </Text>
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 16 },
  line: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: 12, paddingVertical: 4 },
  flex: { flex: 1 },
  photo: { width: '100%', height: 320 },
});
