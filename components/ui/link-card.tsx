import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from './button';
import { Card } from './card';
import { Text } from './text';

export type CardLink = { href: Href; label: string };

/** A card that names a place in the app, says what is there, and links to it. */
export function LinkCard({ title, description, links }: { title: string; description: ReactNode; links: CardLink[] }) {
  return (
    <Card>
      <Text variant="heading">{title}</Text>
      <Text color="textMuted">{description}</Text>
      <View style={styles.actions}>
        {links.map((l) => (
          <Link key={l.label} href={l.href} asChild>
            <Button variant="secondary" label={l.label} />
          </Link>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({ actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 } });
