import { describe, expect, it } from 'vitest';
import { statementMessageId } from '@/lib/ledger/statement-mail';

describe('statement Message-ID', () => {
  it('is the same for every attempt at one statement and differs between statements', () => {
    const from = 'Brixhouse <no-reply@brixhouse.example>';
    expect(statementMessageId('0b5c-1', from)).toBe('<statement-0b5c-1@brixhouse.example>');
    expect(statementMessageId('0b5c-1', from)).toBe(statementMessageId('0b5c-1', from));
    expect(statementMessageId('0b5c-2', from)).not.toBe(statementMessageId('0b5c-1', from));
  });

  it('takes the domain of a bare sender address, and a reserved one when there is none', () => {
    expect(statementMessageId('x', 'treasurer@maple-coop.example')).toBe('<statement-x@maple-coop.example>');
    expect(statementMessageId('x', 'Brixhouse')).toBe('<statement-x@brixhouse.invalid>');
  });
});
