import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useMe } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Screen } from '../ui/screen';
import { LoadingState } from '../ui/states';

/** The admin's desk, page by page: the same row of links on each, the page you are on marked. */
export const ADMIN_PAGES = [
  { href: '/admin/accounts', label: 'Accounts', about: 'Search accounts, make someone a clinician or an admin, disable or enable an account. Each change asks why.' },
  { href: '/admin/outbox', label: 'Outbox', about: 'Mails waiting to go or given up on, with the last error and the attempts; send a failed one again.' },
  { href: '/admin/audit', label: 'Audit', about: 'Role changes, disabled and enabled accounts, and who was given or lost access to which profile.' },
  { href: '/admin/imports', label: 'Imports', about: 'Load the USDA food tables and read the report of each import.' },
] as const satisfies readonly { href: Href; label: string; about: string }[];

type Props = { title: string; subtitle?: string; current?: (typeof ADMIN_PAGES)[number]['href']; children: ReactNode };

/** A page of the admin's desk: admins only (others get a plain note), with the links between its pages. */
export function AdminScreen({ title, subtitle, current, children }: Props) {
  const me = useMe();
  if (me.isPending) return <LoadingState />;
  if (me.data?.user.role !== 'admin') {
    return (
      <Screen title={title} backHref="/more">
        <Callout tone="caution" title="Admins only">Only an administrator can open the admin&apos;s desk.</Callout>
      </Screen>
    );
  }
  return (
    <Screen title={title} subtitle={subtitle} backHref={current ? '/admin' : '/more'}>
      {current ? (
        <View role="navigation" aria-label="Admin's desk" style={styles.nav}>
          {ADMIN_PAGES.map((p) => (
            <Link key={p.href} href={p.href} asChild>
              <Button variant={p.href === current ? 'primary' : 'secondary'} label={p.label} aria-current={p.href === current ? 'page' : undefined} />
            </Link>
          ))}
        </View>
      ) : null}
      {children}
    </Screen>
  );
}

const styles = StyleSheet.create({ nav: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 } });
