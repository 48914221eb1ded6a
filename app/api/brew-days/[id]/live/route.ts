import { NextResponse } from 'next/server';
import { getLiveStateById, recordLiveEntry } from '@/lib/brew-days/live';
import { liveEntrySchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/brew-days/[id]/live – brew-day mode's saved fields and ticked steps, for the brewer
export const GET = route({ access: 'user', params: idParams('brew day') }, ({ viewer, params }) =>
  getLiveStateById(viewer, params.id),
);

// POST /api/brew-days/[id]/live – one reading or ticked step from brew-day mode, saved once per idempotency key
export const POST = route(
  { access: 'user', params: idParams('brew day'), body: liveEntrySchema },
  async ({ viewer, params, body }) => {
    const answer = await recordLiveEntry(viewer, params.id, body);
    return NextResponse.json(answer.body, { status: answer.status });
  },
);

export const dynamic = 'force-dynamic';
