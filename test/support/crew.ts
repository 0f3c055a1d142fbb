// Test set-up: a new person joins a build through a real invite mail, as crew or reviewer.
import { signedUpClient, type ApiClient } from './api-client';
import type { TestApp } from './test-app';

export async function joinByInvite(t: TestApp, owner: ApiClient, buildId: string, role: 'crew' | 'reviewer', label: string) {
  const person = await signedUpClient(t.app, label);
  await owner.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
  const mail = await t.mail.waitFor((m) => m.to.includes(person.email) && m.subject.startsWith('Join'));
  await person.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
  return person;
}
