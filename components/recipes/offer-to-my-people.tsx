import { StyleSheet, View } from 'react-native';
import { useOfferToMyPeople } from '../api/clinician-desk';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

/** For a clinician on their own recipe: one offer to each person they support (each still accepts or declines). */
export function OfferToMyPeople({ recipeId }: { recipeId: number }) {
  const offer = useOfferToMyPeople(recipeId);
  return (
    <View style={styles.block}>
      <Button variant="secondary" label="Offer to everyone I support" loading={offer.isPending} onPress={() => offer.mutate()} />
      {offer.isSuccess ? (
        <Text color="textMuted">
          Offered to {offer.data.people} {offer.data.people === 1 ? 'person' : 'people'}. Each one accepts or declines.
        </Text>
      ) : null}
      {offer.isError ? <Text color="danger">{offer.error.message}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({ block: { gap: 6, alignItems: 'flex-start' } });
