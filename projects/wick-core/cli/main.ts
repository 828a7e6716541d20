/**
 * wick — the physics library from a terminal.
 *   wick list [--json]              every model with its parameters and units
 *   wick run <model> [--json]       reads a JSON request on stdin, writes the JSON result
 * The request is `{ "inputs": { … } }` (or just the inputs object); bare numbers are read in the units that
 * `wick list` shows, strings such as "0.3 mm" carry their own. Same types as the server's compute routes.
 */
import { listModels, runModel, type ComputeRequest, type ModelDescription } from '../src/api/compute';

const USAGE = `usage:
  wick list [--json]          list every model with its parameters and units
  wick run <model> [--json]   read a JSON request on stdin ({"inputs": {...}}) and write the JSON result
  wick help                   this text
Example:
  echo '{"inputs":{"radius":"0.3 mm","surfaceTension":"72.8 mN/m","contactAngle":0,"density":998}}' | wick run jurin-height --json`;

async function readStdin(): Promise<string> {
  if (process.stdin.isTTY) return '';
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

function describe(m: ModelDescription): string {
  const params = m.parameters
    .map((p) => {
      const unit = p.unit && p.unit !== '1' ? ` [${p.unit}]` : '';
      const opt = p.optional || p.default !== undefined ? ` (optional${p.default !== undefined ? `, default ${p.default}` : ''})` : '';
      const choices = p.choices ? ` one of ${p.choices.join('|')}` : '';
      return `      ${p.name}${unit}${opt}${choices} — ${p.label}`;
    })
    .join('\n');
  const example = m.example ? `\n    example: echo '${JSON.stringify({ inputs: m.example })}' | wick run ${m.id}` : '';
  return `  ${m.id}  (${m.family})\n    ${m.title}: ${m.summary}\n${params}${example}`;
}

async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  const json = rest.includes('--json');
  const args = rest.filter((a) => !a.startsWith('--'));
  switch (command) {
    case 'list': {
      const models = listModels();
      process.stdout.write(json ? JSON.stringify(models, null, 2) + '\n' : models.map(describe).join('\n\n') + '\n');
      return 0;
    }
    case 'run': {
      const model = args[0];
      if (!model) {
        process.stderr.write('wick run needs a model id; `wick list` shows them.\n');
        return 2;
      }
      const text = (await readStdin()).trim();
      let body: unknown = {};
      if (text) {
        try {
          body = JSON.parse(text);
        } catch (e) {
          process.stderr.write(`The request on stdin is not valid JSON: ${(e as Error).message}\n`);
          return 2;
        }
      }
      const inputs =
        body && typeof body === 'object' && 'inputs' in body ? (body as ComputeRequest).inputs : (body as Record<string, unknown>);
      const response = runModel({ model, inputs });
      process.stdout.write(JSON.stringify(response, null, json ? 2 : undefined) + '\n');
      if (!response.ok) process.stderr.write(`${response.error.message}\n`);
      return response.ok ? 0 : 1;
    }
    case undefined:
    case 'help':
    case '--help':
      process.stdout.write(USAGE + '\n');
      return command === undefined ? 2 : 0;
    default:
      process.stderr.write(`Unknown command "${command}".\n${USAGE}\n`);
      return 2;
  }
}

process.exitCode = await main(process.argv.slice(2));
