import type { ConfigurationRequirementsDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { useGrantSignoff } from '../api/grant-signoff';

/** The officer signs a person off for one configuration, from a day that may lie ahead (after a supervised session). */
export function GrantSignoffForm({ userId, requirements, today }: { userId: string; requirements: ConfigurationRequirementsDto[]; today: string }) {
  // Configurations that ask for a sign-off come first: they are the ones it changes anything for.
  const sorted = [...requirements].sort((a, b) => Number(!a.signoffLabel) - Number(!b.signoffLabel));
  const [configurationId, setConfigurationId] = useState(sorted[0]?.configurationId ?? '');
  const [grantedOn, setGrantedOn] = useState(today);
  const [expiresOn, setExpiresOn] = useState('');
  const [note, setNote] = useState('');
  const grant = useGrantSignoff();
  const chosen = sorted.find((r) => r.configurationId === configurationId);
  return (
    <form
      data-testid="grant-signoff-form"
      className="grid gap-3 rounded-xl border border-line bg-panel p-4 sm:grid-cols-2"
      onSubmit={(event) => {
        event.preventDefault();
        grant.mutate({ userId, configurationId, grantedOn, expiresOn: expiresOn || null, note }, {
          onSuccess: ({ signoff }) => {
            toast.success(`Signed off for ${signoff.configurationName} from ${signoff.grantedOn}`);
            setNote('');
          },
        });
      }}
    >
      <p className="text-sm font-semibold sm:col-span-2">Grant a configuration sign-off</p>
      <SelectField label="Configuration" name="configurationId" value={configurationId} onChange={(e) => setConfigurationId(e.target.value)}
        hint={chosen?.signoffLabel ?? 'This configuration asks for no sign-off of its own'}>
        {sorted.map((r) => <option key={r.configurationId} value={r.configurationId}>{r.configurationName} · {r.instrumentName}</option>)}
      </SelectField>
      <TextField label="Valid from" name="grantedOn" type="date" required value={grantedOn} onChange={(e) => setGrantedOn(e.target.value)} />
      <TextField label="Expires on (optional)" name="expiresOn" type="date" value={expiresOn} onChange={(e) => setExpiresOn(e.target.value)} />
      <TextField label="Note" name="note" maxLength={500} placeholder="e.g. supervised DFG alignment on 3 Dec" value={note} onChange={(e) => setNote(e.target.value)} />
      {grant.error && <p className="text-sm font-semibold text-danger sm:col-span-2" role="alert">{grant.error.message}</p>}
      <div className="sm:col-span-2"><Button type="submit" busy={grant.isPending} disabled={!configurationId} data-testid="grant-signoff-submit">Grant sign-off</Button></div>
    </form>
  );
}
