import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { shareRecipeInputSchema, type RecipeShare } from '../../shared/schemas/recipe';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';
import { useIsClinician } from '../api/clinician-desk';
import { useRevokeShare, useShareRecipe } from '../api/recipes';
import { OfferToMyPeople } from './offer-to-my-people';

/** The owner's sharing panel: give the recipe to someone by email, see who has it, take it back. */
export function SharePanel({ recipeId, shares }: { recipeId: number; shares: RecipeShare[] }) {
  const form = useForm({ resolver: zodResolver(shareRecipeInputSchema), defaultValues: { email: '' } });
  const share = useShareRecipe(recipeId);
  const revoke = useRevokeShare(recipeId);
  const clinician = useIsClinician();
  const submit = form.handleSubmit(({ email }) => {
    share.mutate(email, {
      onSuccess: () => form.reset({ email: '' }),
      // A refusal that names no field (no such account) is still about the address: it goes under the field too.
      onError: (err) => {
        const rest = applyServerErrors(err, form.setError, ['email']);
        if (rest) form.setError('email', { message: rest });
      },
    });
  });
  return (
    <Card>
      <Text variant="heading">Share</Text>
      <Text color="textMuted">
        We send an offer: once they accept, they can read this recipe and copy it into their own library. They cannot change yours.
      </Text>
      <View style={styles.row}>
        <View style={styles.grow}>
          <FormTextField
            control={form.control}
            name="email"
            label="Their email address"
            inputMode="email"
            autoCapitalize="none"
            onSubmitEditing={() => void submit()}
          />
        </View>
        <Button label="Offer" onPress={() => void submit()} loading={share.isPending} />
      </View>
      {share.isSuccess ? <Text color="textMuted">Offer sent. It appears here once they accept.</Text> : null}
      {clinician ? <OfferToMyPeople recipeId={recipeId} /> : null}
      {shares.length ? (
        <View style={styles.list} role="list" aria-label="Shared with">
          {shares.map((s) => (
            <View key={s.userId} style={styles.person} role="listitem">
              <View style={styles.grow}>
                <Text weight="bold">{s.displayName}</Text>
                <Text variant="caption" color="textMuted">
                  {s.email}
                </Text>
              </View>
              <Button variant="quiet" label={`Stop sharing with ${s.displayName}`} onPress={() => revoke.mutate(s.userId)} />
            </View>
          ))}
        </View>
      ) : (
        <Text variant="caption" color="textMuted">
          Not shared with anyone yet.
        </Text>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-end', gap: 12, flexWrap: 'wrap' },
  grow: { flexGrow: 1, flexShrink: 1, minWidth: 200 },
  list: { gap: 8 },
  person: { flexDirection: 'row', alignItems: 'center', gap: 8, flexWrap: 'wrap' },
});
