import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { Text } from './text';

/** A link that reads as words (berry, bold) but is as easy to tap as a button: at least 44 × 44 px. */
export function TextLink({ href, label }: { href: Href; label: string }) {
  return (
    <Link href={href} asChild>
      <Pressable role="link" style={styles.link}>
        <Text color="primary" weight="bold">
          {label}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({ link: { minHeight: MIN_TOUCH, minWidth: MIN_TOUCH, justifyContent: 'center' } });
