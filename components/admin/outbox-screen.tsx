import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { OutboxFilter, OutboxMail } from '../../shared/schemas/mail';
import { useOutbox, useResendMail } from '../api/admin';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { ChoiceGroup } from '../ui/choice-group';
import { dateTimeText } from '../ui/date-format';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { AdminScreen } from './admin-screen';

type Filter = OutboxFilter | 'all';
const FILTERS: { value: Filter; label: string }[] = [
  { value: 'unsent', label: 'Waiting or failed' },
  { value: 'failed', label: 'Failed' },
  { value: 'pending', label: 'Waiting' },
  { value: 'sent', label: 'Sent' },
  { value: 'all', label: 'All' },
];

/** Where a mail stands, in words: sent when, given up, or waiting for its next try. */
function standing(m: OutboxMail): string {
  const tries = `${m.attempts} attempt${m.attempts === 1 ? '' : 's'}`;
  if (m.status === 'sent') return `Sent${m.sentAt ? ` ${dateTimeText(m.sentAt)}` : ''} after ${tries}`;
  if (m.status === 'failed') return `Failed: given up after ${tries}`;
  return `Waiting: ${tries} so far${m.nextAttemptAt ? ` · next try ${dateTimeText(m.nextAttemptAt)}` : ''}`;
}

function MailRow({ mail, onResend, busy }: { mail: OutboxMail; onResend: () => void; busy: boolean }) {
  const t = useTheme();
  return (
    <View role="listitem" aria-label={`${mail.subject} to ${mail.to}`} style={[styles.row, { borderColor: t.colors.border }]}>
      <View style={styles.grow}>
        <Text weight="bold">{mail.subject}</Text>
        <Text variant="caption" color="textMuted">
          To {mail.to} · {mail.kind.replace(/_/g, ' ')} · queued {dateTimeText(mail.createdAt)}
        </Text>
        <Text variant="caption" color={mail.status === 'failed' ? 'danger' : 'text'} weight={mail.status === 'failed' ? 'bold' : 'regular'}>
          {standing(mail)}
        </Text>
        {mail.lastError && mail.status !== 'sent' ? <Text variant="caption">Last error: {mail.lastError}</Text> : null}
      </View>
      {mail.canResend ? <Button variant="secondary" label={`Resend to ${mail.to}`} loading={busy} onPress={onResend} /> : null}
    </View>
  );
}

/** The mail outbox: what is waiting, what failed and why, and a resend for a failed mail. */
export function OutboxScreen() {
  return (
    <AdminScreen title="Outbox" subtitle="Mails are retried with growing waits; after the last attempt they are marked failed" current="/admin/outbox">
      <Outbox />
    </AdminScreen>
  );
}

function Outbox() {
  const [filter, setFilter] = useState<Filter>('unsent');
  const mails = useOutbox(filter);
  const resend = useResendMail();
  return (
    <>
      <ChoiceGroup label="Show" value={filter} onChange={setFilter} choices={FILTERS} />
      {resend.isSuccess ? <Callout tone="ok" title="Queued again">{`The mail to ${resend.data.to} goes out with the next round of sending.`}</Callout> : null}
      {resend.isError ? <Callout tone="danger" title="Not queued">{(resend.error as Error).message}</Callout> : null}
      {mails.isPending ? (
        <LoadingState label="Loading the outbox…" />
      ) : mails.isError ? (
        <ErrorState error={mails.error} onRetry={() => void mails.refetch()} />
      ) : mails.data.length === 0 ? (
        <EmptyState title={filter === 'unsent' || filter === 'failed' ? 'Nothing stuck' : 'No mail here'}>
          {filter === 'unsent' ? 'Every mail has gone out.' : 'No mail with this status.'}
        </EmptyState>
      ) : (
        <Card>
          <Text variant="caption" color="textMuted">
            Newest first{mails.data.length === 200 ? ', the latest 200' : ''}. Bodies are not shown: they hold single-use links.
          </Text>
          <View role="list" aria-label="Mails">
            {mails.data.map((m) => (
              <MailRow key={m.id} mail={m} busy={resend.isPending && resend.variables === m.id} onResend={() => resend.mutate(m.id)} />
            ))}
          </View>
        </Card>
      )}
    </>
  );
}

const styles = StyleSheet.create({
  row: { borderTopWidth: 1, paddingVertical: 10, flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: 8 },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 240, gap: 2 },
});
