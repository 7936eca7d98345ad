import { Image, StyleSheet, View } from 'react-native';
import type { RecipePhoto as Photo } from '../../shared/schemas/recipe';
import { API_BASE } from '../api/client';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

/** A recipe photo from its signed link (the server only hands links to people who may see the recipe); thumbnails without one show an initial. */
export function RecipePhoto({ photo, title, size }: { photo: Photo | null; title: string; size: 'thumb' | 'large' }) {
  const t = useTheme();
  const box = size === 'thumb' ? styles.thumb : styles.large;
  if (!photo && size === 'large') return null;
  if (!photo) {
    return (
      <View style={[box, styles.empty, { backgroundColor: t.colors.surfaceAlt, borderColor: t.colors.border }]} aria-hidden>
        <Text variant={size === 'thumb' ? 'heading' : 'display'} color="textMuted">
          {title.trim().charAt(0).toUpperCase() || '·'}
        </Text>
      </View>
    );
  }
  return (
    <Image
      source={{ uri: `${API_BASE}${size === 'thumb' ? photo.thumbUrl : photo.largeUrl}` }}
      accessibilityLabel={`Photo of ${title}`}
      style={[box, { backgroundColor: t.colors.surfaceAlt }]}
      resizeMode="cover"
    />
  );
}

const styles = StyleSheet.create({
  thumb: { width: 64, height: 64, borderRadius: 10 },
  large: { width: '100%', aspectRatio: 16 / 10, maxHeight: 360, borderRadius: 14 },
  empty: { alignItems: 'center', justifyContent: 'center', borderWidth: 1 },
});
