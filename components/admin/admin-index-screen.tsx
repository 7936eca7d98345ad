import { LinkCard } from '../ui/link-card';
import { AdminScreen, ADMIN_PAGES } from './admin-screen';

/** The admin's desk: what each page is for, and a link to it. */
export function AdminIndexScreen() {
  return (
    <AdminScreen title="Admin's desk" subtitle="Accounts, mail, the audit and the food tables">
      {ADMIN_PAGES.map((p) => (
        <LinkCard key={p.href} title={p.label} description={p.about} links={[{ href: p.href, label: `Open ${p.label.toLowerCase()}` }]} />
      ))}
    </AdminScreen>
  );
}
