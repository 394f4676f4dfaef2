import { describe, expect, it } from 'vitest';
import { ageOn } from '../../../app/host/demo/demo-participant';
import { parsePersonalDataTsv, passphraseFromFile } from '../../../app/host/demo/personal-data-tsv';

const header = 'name\temail\tbirth_date\tconsent_note\tshare\twithdrawn';

describe('--personal-data TSV', () => {
  it('reads the columns in any order, yes/no in any case, CRLF line ends and trailing blank lines', () => {
    const text = `withdrawn\tshare\tconsent_note\tbirth_date\temail\tname\r\nNo\tYES\tnote here\t2001-02-28\tx@y.org\tCam Beacon\r\n\r\n`;
    expect(parsePersonalDataTsv(text, 'p.tsv')).toEqual([{ name: 'Cam Beacon', email: 'x@y.org', birthDate: '2001-02-28', consentNote: 'note here', share: true, withdrawn: false }]);
  });

  it.each([
    [`name\temail\n`, 'p.tsv:1: no "birth_date" column'],
    [`${header}\nA\ta@b.c\t1990-01-01\t\tyes\n`, 'p.tsv:2: 5 columns, the header has 6'],
    [`${header}\n\ta@b.c\t1990-01-01\t\tyes\tno\n`, 'p.tsv:2: column "name": empty'],
    [`${header}\nA\tnot-an-address\t1990-01-01\t\tyes\tno\n`, 'p.tsv:2: column "email": expected an e-mail address, got "not-an-address"'],
    [`${header}\nA\ta@b.c\t1990-02-30\t\tyes\tno\n`, 'p.tsv:2: column "birth_date": expected a date as YYYY-MM-DD, got "1990-02-30"'],
    [`${header}\nA\ta@b.c\t1990-02-03\t\tyes\tno\nB\tb@b.c\t1990-02-03\t\tyes\tperhaps\n`, 'p.tsv:3: column "withdrawn": expected yes or no, got "perhaps"'],
    ['', 'p.tsv: empty'],
  ])('names the line and column of a bad value (%#)', (text, message) => {
    expect(() => parsePersonalDataTsv(text, 'p.tsv')).toThrow(message);
  });

  it('strips exactly one trailing newline from the passphrase file', () => {
    expect(passphraseFromFile('aisle 3\n', 'f')).toBe('aisle 3');
    expect(passphraseFromFile('aisle 3\r\n', 'f')).toBe('aisle 3');
    expect(passphraseFromFile('aisle 3\n\n', 'f')).toBe('aisle 3\n');
    expect(passphraseFromFile(' spaced ', 'f')).toBe(' spaced ');
    expect(() => passphraseFromFile('\n', 'f')).toThrow('f: the passphrase is empty');
  });

  it('gives the age in whole years on the registration day (common practice, no source)', () => {
    expect(ageOn('1990-04-01', new Date('2026-03-31T12:00:00Z'))).toBe(35);
    expect(ageOn('1990-04-01', new Date('2026-04-01T00:00:00Z'))).toBe(36);
    expect(ageOn('2000-02-29', new Date('2026-02-28T00:00:00Z'))).toBe(25);
  });
});
