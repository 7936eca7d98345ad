import { AppTabs } from '@/components/nav/app-tabs';

export default function TabsLayout() {
  return <AppTabs />;
}
