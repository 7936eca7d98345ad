import { useMe } from '../api/auth';
import type { ShareOption } from './pack-food-form';

/** Who a pack food can be shared with: only me, or the care team of a profile the person owns or cares for. */
export function usePackFoodShareOptions(): { me: ReturnType<typeof useMe>; shareOptions: ShareOption[] } {
  const me = useMe();
  const shareOptions: ShareOption[] = [
    { profileId: null, label: 'Only me' },
    ...(me.data?.profiles ?? [])
      .filter((p) => p.access === 'owner' || p.access === 'carer')
      .map((p) => ({ profileId: p.id, label: `Everyone who looks after ${p.displayName}` })),
  ];
  return { me, shareOptions };
}
