import { StyleSheet, View } from 'react-native';
import { useAnswerOffer, useRecipeOffers } from '../api/recipes';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';

/** Recipes someone offered me: accept puts one on the "shared with me" shelf; decline drops the offer. */
export function RecipeOffers() {
  const offers = useRecipeOffers();
  const answer = useAnswerOffer();
  if (!offers.data?.length) return null;
  return (
    <Card>
      <Text variant="heading">Offered to you</Text>
      <View role="list" aria-label="Recipes offered to you" style={styles.list}>
        {offers.data.map((o) => (
          <View key={o.id} role="listitem" style={styles.row}>
            <Text style={styles.grow}>
              {o.senderName} offers you “{o.recipeTitle}”.
            </Text>
            <Button label={`Accept ${o.recipeTitle}`} onPress={() => answer.mutate({ id: o.id, accept: true })} />
            <Button variant="quiet" label={`Decline ${o.recipeTitle}`} onPress={() => answer.mutate({ id: o.id, accept: false })} />
          </View>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: 8 },
  row: { flexDirection: 'row', alignItems: 'center', gap: 8, flexWrap: 'wrap' },
  grow: { flexGrow: 1, flexShrink: 1, minWidth: 200 },
});
