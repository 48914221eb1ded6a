// Prints the stats of a recipe document read from stdin as JSON.
// Usage: npx tsx scripts/calc.ts < recipe.json
// Exit status 2 on unreadable JSON or a document the schema refuses, one `path: message` line per bad field on stderr.
import { computeStats, formatIssues, recipeDocumentSchema } from '../lib/brewing';

const INVALID_INPUT_EXIT_CODE = 2;

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks).toString('utf8');
}

function refuse(lines: string[]): never {
  process.stderr.write(lines.map((line) => `${line}\n`).join(''));
  process.exit(INVALID_INPUT_EXIT_CODE);
}

async function main(): Promise<void> {
  const text = await readStdin();
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (error) {
    refuse([`(input): not valid JSON: ${error instanceof Error ? error.message : String(error)}`]);
  }
  const parsed = recipeDocumentSchema.safeParse(input);
  if (!parsed.success) {
    refuse(formatIssues(parsed.error).map((issue) => `${issue.path || '(document)'}: ${issue.message}`));
  }
  process.stdout.write(`${JSON.stringify(computeStats(parsed.data), null, 2)}\n`);
}

void main();
