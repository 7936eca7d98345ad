import { ApiError } from '../api/client';
import { useConfirmEmailChange, useMe } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';

const FAILED = 'We could not reach Carbwright. Check your connection and try again.';

/** The page the link in the confirmation mail opens (signed in): one press moves the account to the new address. */
export function ConfirmEmailScreen({ token }: { token: string }) {
  const me = useMe();
  const confirm = useConfirmEmailChange();
  const done = confirm.data?.me.user.email;
  return (
    <Screen title="Confirm your new e-mail address" backHref="/more">
      <Card>
        {done ? (
          <Callout tone="ok" title="Address changed">
            {`From now on, sign in with ${done}. Other devices have been signed out, and the old address has been told.`}
          </Callout>
        ) : !token ? (
          <Callout tone="danger" title="Address not changed">
            This link is incomplete. Ask for a new one.
          </Callout>
        ) : (
          <>
            <Text>
              {me.data ? `You are signed in as ${me.data.user.email}. ` : ''}
              Confirm to use the address this link was sent to instead. Other devices will be signed out.
            </Text>
            {confirm.isError ? (
              <Callout tone="danger" title="Address not changed">
                {confirm.error instanceof ApiError ? confirm.error.message : FAILED}
              </Callout>
            ) : null}
            <Button label="Confirm the new address" loading={confirm.isPending} onPress={() => confirm.mutate(token)} />
          </>
        )}
        {done ? <TextLink href="/more" label="Back to your page" /> : <TextLink href="/more/email" label="Ask for a new link" />}
      </Card>
    </Screen>
  );
}
