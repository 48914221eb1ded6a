import { route } from '@/lib/http/route';

// GET /api/me – the signed-in member, or null
export const GET = route({ access: 'public' }, ({ viewer }) => ({ viewer }));
export const dynamic = 'force-dynamic';
