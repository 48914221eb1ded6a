import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { hasRole, type Role } from './roles';
import { getViewer, type Viewer } from './session';

/** For pages: signed-out visitors go to sign-in and come back; a too-low role sees a plain 404. */
export async function requirePageViewer(path: string, role: Role = 'member'): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) redirect(`/sign-in?callbackUrl=${encodeURIComponent(path)}`);
  if (!hasRole(viewer, role)) notFound();
  return viewer;
}
