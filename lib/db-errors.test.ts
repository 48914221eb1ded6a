import { DrizzleQueryError } from 'drizzle-orm/errors';
import { describe, expect, it } from 'vitest';
import { loggableError, uniqueViolation } from './db-errors';

function driverError(code: string, constraint?: string): Error {
  return Object.assign(new Error('duplicate key value violates unique constraint'), { code, constraint });
}

describe('uniqueViolation', () => {
  it('finds the SQLSTATE on the driver error that Drizzle wraps', () => {
    const wrapped = new DrizzleQueryError(
      'insert into "users" …',
      ['a@b.test', '$2b$12$hash'],
      driverError('23505', 'users_email_key'),
    );
    expect(uniqueViolation(wrapped)).toEqual({ constraint: 'users_email_key' });
    expect(uniqueViolation(driverError('23505'))).toEqual({ constraint: null });
  });

  it('says nothing of other errors', () => {
    expect(uniqueViolation(new DrizzleQueryError('select 1', [], driverError('23503')))).toBeNull();
    expect(uniqueViolation(new Error('boom'))).toBeNull();
  });
});

describe('loggableError', () => {
  it('describes a failed query without its parameters', () => {
    const text = loggableError(
      new DrizzleQueryError(
        'insert into "users" ("email", "password_hash") values ($1, $2)',
        ['someone@kettlefork.test', '$2b$12$abcdefghijklmnopqrstuv'],
        driverError('23505', 'users_handle_key'),
      ),
    );
    expect(text).toContain('code 23505');
    expect(text).toContain('constraint users_handle_key');
    expect(text).toContain('values ($1, $2)');
    expect(text).not.toContain('someone@kettlefork.test');
    expect(text).not.toContain('$2b$12$');
  });
});
