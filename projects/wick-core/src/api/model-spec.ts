import type { ModelWarning } from '../errors';

/**
 * How a model describes itself to the CLI (`wick list`), the server's compute routes and the UI.
 * A bare number given for a parameter is read in `unit`; a string such as "0.3 mm" is parsed
 * by the units module and converted. `run` always receives SI values (angles in radians).
 */
export interface ParameterSpec {
  readonly name: string;
  /** Human label, e.g. "Contact angle". */
  readonly label: string;
  /**
   * Unit a bare number is read in, as the units module writes it ('m', 'N/m', 'Pa s', 'kg/m^3',
   * 'deg', 's', 'K', 'm^2', '1' for dimensionless). Empty for non-numeric parameters, and for numeric ones whose
   * quantity depends on another parameter: those take SI values as given (their description says so).
   */
  readonly unit: string;
  /** 'object': structured JSON (object, list or keyword) whose shape the description gives and the model checks. */
  readonly kind: 'number' | 'number[]' | 'string' | 'boolean' | 'object';
  readonly description: string;
  readonly optional?: boolean;
  readonly default?: number | string | boolean;
  /** For kind 'string': the allowed values. */
  readonly choices?: readonly string[];
}

export interface ModelSpec<I = Record<string, unknown>, O = unknown> {
  /** Stable id used on the wire and by `wick run <id>`, kebab-case, e.g. 'jurin-height'. */
  readonly id: string;
  /** Folder it lives in, e.g. 'jurin'. */
  readonly family: string;
  readonly title: string;
  /** One sentence: what it computes, the equation's name and its source. */
  readonly summary: string;
  readonly parameters: readonly ParameterSpec[];
  run(input: I): O;
}

/** Every model result carries what it used and any validity remarks. */
export interface ResultBase<I> {
  readonly inputs: I;
  readonly warnings: readonly ModelWarning[];
}
