import 'server-only';
import { format } from 'date-fns';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { brewDays, recipeVersions } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { loadOwnBrewDay, loadVisibleBrewDay } from './brew-days';
import { planToIcs } from './plan-ics';
import { PlanDateError, planBrew, type BrewPlan, type PlanOptions } from './schedule';

/** Today's date where the server stands; the schedule itself never reads a clock. */
function todayIso(): string {
  return format(new Date(), 'yyyy-MM-dd');
}

/** Plans the brewer's own brew day back from its pour date and keeps the plan with it. */
export async function saveBrewDayPlan(
  viewer: Viewer,
  brewDayId: string,
  options: PlanOptions,
  today: string = todayIso(),
): Promise<BrewPlan> {
  const { day } = await loadOwnBrewDay(viewer, brewDayId, 'plan');
  const [version] = await db
    .select({ document: recipeVersions.document })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, day.versionId));
  let plan: BrewPlan;
  try {
    plan = planBrew(version.document, { ...options, brewOn: options.brewOn ?? day.brewedOn }, today);
  } catch (err) {
    if (err instanceof PlanDateError)
      throw new AppError('bad_request', 'plan', `Please check these fields: ${err.field}: ${err.message}`, [
        { path: err.field, message: err.message },
      ]);
    throw err;
  }
  await db.update(brewDays).set({ plan, updatedAt: new Date() }).where(eq(brewDays.id, day.id));
  return plan;
}

/** The saved plan of a brew day the viewer may see, as an iCalendar file; 404 when none was made. */
export async function getBrewDayPlanIcs(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  brewDayId: string,
  siteUrl: string,
): Promise<{ ics: string; filename: string }> {
  const { day } = await loadVisibleBrewDay(viewer, brewDayId);
  if (!day.plan) throw new AppError('not_found', 'brew plan');
  const [version] = await db
    .select({ document: recipeVersions.document })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, day.versionId));
  const title = version.document.title;
  const ics = planToIcs(day.plan, { title, url: `${siteUrl}/brew-days/${day.id}`, uidBase: day.id });
  return { ics, filename: `brew-plan-${day.plan.brewOn}.ics` };
}
