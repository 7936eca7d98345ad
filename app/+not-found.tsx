import { Link, Stack } from 'expo-router';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';

export default function NotFound() {
  return (
    <>
      <Stack.Screen options={{ title: 'Not found' }} />
      <Screen title="Nothing on this shelf">
        <Text color="textMuted">That page does not exist, or it moved.</Text>
        <Link href="/">
          <Text color="primary" weight="bold">
            Back to today
          </Text>
        </Link>
      </Screen>
    </>
  );
}
