import { openText } from '../../../app/core/crypto';
import type { ConsentRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { operatorNames } from '../lab/operators';
import { useOpened } from '../lab/use-opened';
import { scopeLabels, withdrawalScopeLabels } from './consent-status';
import { WithdrawConsent } from './WithdrawConsent';

const scopeKeys = Object.keys(scopeLabels) as (keyof typeof scopeLabels)[];

export function ConsentList({ consents }: { consents: readonly ConsentRecord[] }) {
  const { store } = useLab();
  const operators = useOpened(async (key) => new Map((await operatorNames(store, key)).map((o) => [o.id, o.name])), [store, consents]);
  if (consents.length === 0) return <p className="muted">No consent is recorded.</p>;
  const operatorName = (id: string) => operators.value?.get(id) ?? (operators.value ? 'unknown operator' : 'locked');
  return (
    <ul className="consents" aria-label="Consent records">
      {[...consents]
        .sort((a, b) => a.signedAt.localeCompare(b.signedAt))
        .map((c) => (
          <li key={c.id} className="consent panel">
            <p>
              <strong>Form {c.formVersion}</strong>, signed {new Date(c.signedAt).toLocaleString()}, recorded by {operatorName(c.operatorId)}
            </p>
            <ul aria-label={`Scopes of form ${c.formVersion}`}>
              {scopeKeys.map((k) => (
                <li key={k}>
                  {c.scopes[k] ? 'yes' : 'no'}: {scopeLabels[k]}
                </li>
              ))}
            </ul>
            <ConsentTexts consent={c} />
            {c.withdrawal ? (
              <p className="warning">
                Withdrawn {new Date(c.withdrawal.at).toLocaleString()} by {operatorName(c.withdrawal.operatorId)}: {withdrawalScopeLabels[c.withdrawal.scope]}
              </p>
            ) : (
              <WithdrawConsent consent={c} />
            )}
          </li>
        ))}
    </ul>
  );
}

function ConsentTexts({ consent: c }: { consent: ConsentRecord }) {
  const texts = useOpened(
    async (key) => ({ signature: await openText(key, c.signatureRef), note: await openText(key, c.note), withdrawal: c.withdrawal ? await openText(key, c.withdrawal.note) : null }),
    [c],
  );
  if (!texts.value) return c.signatureRef || c.note ? <p className="muted">Signature reference and notes: locked</p> : null;
  return (
    <>
      {texts.value.signature && <p>Signature reference: {texts.value.signature}</p>}
      {texts.value.note && <p>Note: {texts.value.note}</p>}
      {texts.value.withdrawal && <p>Withdrawal note: {texts.value.withdrawal}</p>}
    </>
  );
}
