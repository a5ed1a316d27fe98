/** The register's typed failure: an HTTP status, a stable kebab-case code and a sentence a field user understands. */
import type { Issue } from '../data/errors.ts';

export class RegisterError extends Error {
  override readonly name = 'RegisterError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: Issue[] = [],
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
  }
}

export const badRequest = (code: string, message: string, issues: Issue[] = []) => new RegisterError(400, code, message, issues);
export const forbidden = (code: string, message: string) => new RegisterError(403, code, message);
export const READ_ONLY = () => forbidden('read-only-member', 'Your sign-in can read and export the register but not change it; ask the team lead for crew access.');
