import { sql } from 'drizzle-orm';
import { NextResponse } from 'next/server';
import { db } from '@/db';

// GET /api/health – 200 when the database answers, 503 otherwise
export async function GET() {
  try {
    await db.execute(sql`select 1`);
    return NextResponse.json({ status: 'ok' });
  } catch {
    return NextResponse.json({ status: 'unavailable', message: 'The database is not reachable.' }, { status: 503 });
  }
}
export const dynamic = 'force-dynamic';
