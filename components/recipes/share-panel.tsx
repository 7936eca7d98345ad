import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { RecipeShare } from '../../shared/schemas/recipe';
import { shareRecipeInputSchema } from '../../shared/schemas/recipe';
import { ApiError } from '../api/client';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { useRevokeShare, useShareRecipe } from '../api/recipes';

/** The owner's sharing panel: give the recipe to someone by email, see who has it, take it back. */
export function SharePanel({ recipeId, shares }: { recipeId: number; shares: RecipeShare[] }) {
  const [email, setEmail] = useState('');
  const [error, setError] = useState<string>();
  const share = useShareRecipe(recipeId);
  const revoke = useRevokeShare(recipeId);
  const submit = () => {
    const parsed = shareRecipeInputSchema.safeParse({ email });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    share.mutate(parsed.data.email, {
      onSuccess: () => setEmail(''),
      onError: (err) => setError(err instanceof ApiError ? (err.fieldErrors?.email?.[0] ?? err.message) : 'Not shared. Please try again.'),
    });
  };
  return (
    <Card>
      <Text variant="heading">Share</Text>
      <Text color="textMuted">People you share with can read this recipe and copy it into their own library. They cannot change yours.</Text>
      <View style={styles.row}>
        <View style={styles.grow}>
          <TextField
            label="Their email address"
            value={email}
            onChangeText={setEmail}
            error={error}
            inputMode="email"
            autoCapitalize="none"
            onSubmitEditing={submit}
          />
        </View>
        <Button label="Share" onPress={submit} loading={share.isPending} />
      </View>
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
