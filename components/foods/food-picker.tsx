import { useQueryClient } from '@tanstack/react-query';
import type { IFuseOptions } from 'fuse.js';
import { useMemo, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Food, FoodSummary } from '../../shared/schemas/food';
import { useActiveProfile } from '../api/auth';
import { foodQueryOptions, useFoodSearchPages } from '../api/foods';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { useFuse } from '../ui/use-fuse';
import { BASIS_WORDS } from './food-carb';
import { FoodRow } from './food-row';
import { myFoods, useMyFoods } from './my-foods-store';
import { useDebouncedValue } from './use-debounced-value';

export type FoodPickerProps = {
  /** Called with the full food (values, measures, source) once the person picks one. */
  onPick: (food: Food) => void;
  /** Highlights the food currently shown or chosen. */
  selectedId?: number | null;
  label?: string;
  autoFocus?: boolean;
};

const SAVED_SEARCH: IFuseOptions<FoodSummary> = { keys: ['name', 'altNames'], threshold: 0.35, ignoreLocation: true };

/**
 * Search-as-you-type food picker: the food table (debounced, stale requests cancelled) plus the person's recent and
 * favourite foods (kept on this device, searched locally). Shows carbohydrate per 100 g in the profile's basis.
 */
export function FoodPicker({ onPick, selectedId, label = 'Search foods', autoFocus }: FoodPickerProps) {
  const [text, setText] = useState('');
  const q = useDebouncedValue(text.trim(), 250);
  const { profile } = useActiveProfile();
  const basis = profile?.carbBasis ?? 'available';
  const unit = profile?.carbUnit ?? 'g';
  const mine = useMyFoods();
  const queryClient = useQueryClient();
  const [picking, setPicking] = useState<number | null>(null);
  const [pickError, setPickError] = useState<string | null>(null);
  const results = useFoodSearchPages({ q }, q.length > 0);

  const saved = useMemo(() => {
    const byId = new Map<number, FoodSummary>();
    for (const f of [...mine.favourites, ...mine.recent]) if (!byId.has(f.id)) byId.set(f.id, f);
    return [...byId.values()];
  }, [mine]);
  const fuse = useFuse(saved, SAVED_SEARCH);
  const localHits = q && fuse ? fuse.search(q, { limit: 5 }).map((r) => r.item) : [];
  const favouriteIds = new Set(mine.favourites.map((f) => f.id));

  const pick = async (food: FoodSummary) => {
    setPicking(food.id);
    setPickError(null);
    try {
      const full = await queryClient.fetchQuery(foodQueryOptions(food.id));
      myFoods.touch(food);
      onPick(full);
    } catch {
      setPickError('That food did not load. Please try again.');
    } finally {
      setPicking(null);
    }
  };

  const row = (food: FoodSummary, key: string) => (
    <FoodRow
      key={key}
      food={food}
      basis={basis}
      unit={unit}
      favourite={favouriteIds.has(food.id)}
      selected={selectedId === food.id || picking === food.id}
      onPress={() => void pick(food)}
      onToggleFavourite={() => myFoods.toggleFavourite(food)}
    />
  );

  const serverHits = (results.data?.pages ?? []).flatMap((p) => p.items).filter((f) => !localHits.some((l) => l.id === f.id));
  return (
    <View style={styles.wrap}>
      <TextField
        label={label}
        value={text}
        onChangeText={setText}
        placeholder="e.g. banana, rice, paneer"
        autoFocus={autoFocus}
        autoCapitalize="none"
        autoCorrect={false}
        role="searchbox"
        hint={`Carbohydrate shown per 100 g as ${BASIS_WORDS[basis]}.`}
      />
      {pickError ? <Callout tone="caution">{pickError}</Callout> : null}
      {!q ? (
        <>
          {mine.favourites.length ? <Section title="Favourites">{mine.favourites.map((f) => row(f, `fav-${f.id}`))}</Section> : null}
          {mine.recent.length ? <Section title="Recent">{mine.recent.slice(0, 8).map((f) => row(f, `recent-${f.id}`))}</Section> : null}
          {!saved.length ? <Text color="textMuted">Type a food&apos;s name. Foods you pick or star are kept here for next time.</Text> : null}
        </>
      ) : (
        <>
          {localHits.length ? <Section title="Yours">{localHits.map((f) => row(f, `mine-${f.id}`))}</Section> : null}
          <Section title="Food table">
            {results.isPending ? <LoadingState label="Searching…" /> : null}
            {results.isError ? <Callout tone="caution">The search did not answer. Check your connection and type again.</Callout> : null}
            {results.data && !serverHits.length && !localHits.length ? (
              <Text color="textMuted">No food matches “{q}”. Try a shorter word, or add it from a package label.</Text>
            ) : null}
            {serverHits.map((f) => row(f, `hit-${f.id}`))}
            {results.hasNextPage ? (
              <Button variant="secondary" label="Show more" loading={results.isFetchingNextPage} onPress={() => void results.fetchNextPage()} />
            ) : null}
          </Section>
        </>
      )}
    </View>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <Text variant="label" color="textMuted">
        {title}
      </Text>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 14 },
  section: { gap: 8 },
});
