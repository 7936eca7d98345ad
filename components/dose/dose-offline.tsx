import { Link } from 'expo-router';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';

/** In place of the dose check while offline: no dose is worked out, nothing is logged, no earlier answer is shown. */
export function DoseOffline({ log }: { log: boolean }) {
  return (
    <Screen title={log ? 'Log a meal' : 'Check a dose'} backHref="/">
      <Callout tone="danger" title="Offline: no dose is worked out">
        <Text>
          Carbwright works out a dose only with a connection, from your ratios, limits and earlier doses as they are now:
          an answer from an old copy could be wrong. {log ? 'Nothing is logged or saved either. ' : ''}When you are back
          online, check again. If you need to dose before then, follow the plan your diabetes team gave you.
        </Text>
        <Link href="/" asChild>
          <Button variant="secondary" label="Back to Today" />
        </Link>
      </Callout>
    </Screen>
  );
}
