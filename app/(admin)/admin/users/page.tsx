import { format } from 'date-fns';
import type { Metadata } from 'next';
import { listUsers } from '@/lib/auth/accounts';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { RoleSelect } from './_components/role-select';

export const metadata: Metadata = { title: 'Members and roles' };

export default async function AdminUsersPage() {
  const viewer = await requirePageViewer('/admin/users', 'admin');
  const members = await listUsers();
  return (
    <div>
      <h1 className="text-3xl font-semibold">Members and roles</h1>
      <p className="mt-2 font-sans text-sm text-muted">Every change of role is written to the moderation log.</p>
      <div className="mt-6 overflow-x-auto">
        <table className="w-full border-collapse font-sans text-sm">
          <caption className="sr-only">All members with their roles</caption>
          <thead>
            <tr className="border-b border-line text-left">
              <th scope="col" className="py-2 pr-4">
                Name
              </th>
              <th scope="col" className="py-2 pr-4">
                E-mail
              </th>
              <th scope="col" className="py-2 pr-4">
                Joined
              </th>
              <th scope="col" className="py-2 pr-4">
                Status
              </th>
              <th scope="col" className="py-2">
                Role
              </th>
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.id} className="border-b border-line/60">
                <td className="py-2 pr-4">
                  {m.name} <span className="text-muted">@{m.handle}</span>
                </td>
                <td className="py-2 pr-4">{m.email}</td>
                <td className="kf-data py-2 pr-4">{format(m.createdAt, 'd MMM yyyy')}</td>
                <td className="py-2 pr-4">
                  {m.suspendedAt ? <span className="text-danger">suspended</span> : 'active'}
                </td>
                <td className="py-2">
                  <RoleSelect userId={m.id} name={m.name ?? m.handle} role={m.role} disabled={m.id === viewer.id} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
