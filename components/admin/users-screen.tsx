import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { useMe } from '@/lib/api/account';
import { useUsers } from '@/lib/api/admin';
import { Notice } from '@/components/account/form-bits';
import { AdminTabs } from './admin-tabs';
import { InviteCard } from './invite-card';
import { UserRow } from './user-row';

export function UsersScreen() {
  const { data: me } = useMe();
  const users = useUsers();
  return (
    <Screen kicker="Admin" title="People">
      <AdminTabs />
      {users.error ? <Notice kind="refused">{users.error.message}</Notice> : null}
      {users.data ? (
        <>
          <InviteCard />
          <Card title={`Everyone (${users.data.users.length})`}>
            {users.data.users.map((u) => (
              <UserRow key={`${u.id}:${u.roles.join()}:${u.status}`} user={u} isMe={u.id === me?.id} />
            ))}
          </Card>
        </>
      ) : !users.error ? (
        <Text className="text-ink-soft">Loading people…</Text>
      ) : null}
    </Screen>
  );
}
