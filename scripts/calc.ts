// Prints the stats of a recipe document read from stdin as JSON.
// Usage: npx tsx scripts/calc.ts < recipe.json
//        npx tsx scripts/calc.ts --scale '{"volumeL":40,"efficiencyPct":65}' < recipe.json
//        (fits the recipe to that brewhouse, keeping OG, IBU and colour; prints { document, stats })
// Exit status 2 on unreadable JSON or a document the schema refuses, one `path: message` line per bad field on stderr.
import { z } from 'zod';
import { computeStats, formatIssues, recipeDocumentSchema, scaleRecipe, type ScaleTarget } from '../lib/brewing';

const INVALID_INPUT_EXIT_CODE = 2;

/** The brewhouse a recipe is fitted to: the same bounds as the document's batch fields. */
const scaleTargetSchema = z.object({
  volumeL: z
    .number({ error: 'Scale volume must be a number' })
    .min(0.1, 'Scale volume must be at least 0.1 L')
    .max(2000, 'Scale volume must be at most 2000 L'),
  efficiencyPct: z
    .number({ error: 'Brewhouse efficiency must be a number' })
    .min(10, 'Brewhouse efficiency must be at least 10%')
    .max(100, 'Brewhouse efficiency must be at most 100%')
    .optional(),
  boilOffLPerHour: z.number({ error: 'Boil-off rate must be a number' }).min(0).max(100).optional(),
  trubLossL: z.number({ error: 'Kettle trub loss must be a number' }).min(0).max(500).optional(),
  grainAbsorptionLPerKg: z.number({ error: 'Grain absorption must be a number' }).min(0).max(3).optional(),
  mashWaterLPerKg: z.number({ error: 'Mash thickness must be a number' }).min(1).max(30).optional(),
});

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks).toString('utf8');
}

function refuse(lines: string[]): never {
  process.stderr.write(lines.map((line) => `${line}\n`).join(''));
  process.exit(INVALID_INPUT_EXIT_CODE);
}

function parseJson(text: string, what: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    refuse([`${what}: not valid JSON: ${error instanceof Error ? error.message : String(error)}`]);
  }
}

function scaleArgument(args: string[]): ScaleTarget | null {
  const at = args.indexOf('--scale');
  if (at === -1) return null;
  if (args[at + 1] === undefined) refuse(['scale: --scale needs a JSON object, e.g. {"volumeL":40}']);
  const parsed = scaleTargetSchema.safeParse(parseJson(args[at + 1], 'scale'));
  if (!parsed.success) refuse(formatIssues(parsed.error).map((issue) => `scale.${issue.path}: ${issue.message}`));
  return parsed.data;
}

async function main(): Promise<void> {
  const scale = scaleArgument(process.argv.slice(2));
  const input = parseJson(await readStdin(), '(input)');
  const parsed = recipeDocumentSchema.safeParse(input);
  if (!parsed.success) {
    refuse(formatIssues(parsed.error).map((issue) => `${issue.path || '(document)'}: ${issue.message}`));
  }
  if (!scale) {
    process.stdout.write(`${JSON.stringify(computeStats(parsed.data), null, 2)}\n`);
    return;
  }
  // The fitted recipe must itself be a valid document (a much lower efficiency can push the grist past its bound).
  const fitted = recipeDocumentSchema.safeParse(scaleRecipe(parsed.data, scale));
  if (!fitted.success) {
    refuse(formatIssues(fitted.error).map((issue) => `fitted.${issue.path || '(document)'}: ${issue.message}`));
  }
  process.stdout.write(`${JSON.stringify({ document: fitted.data, stats: computeStats(fitted.data) }, null, 2)}\n`);
}

void main();
