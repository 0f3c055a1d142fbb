// "Accept all": each named line (or every unassigned line) goes to its top suggestion when that scores at least the
// threshold, through the same line edit a person's assignment takes, so each change is checked and audited alike.
import type { EntityManager } from '@mikro-orm/postgresql';
import { ACCEPT_ALL_THRESHOLD } from '../../../shared/api/suggestions';
import type { User } from '../auth/user.entity';
import { NotFound } from '../http/errors';
import { updateLine } from '../receipts/receipt-lines.service';
import { ReceiptLine } from '../receipts/receipt-line.entity';
import type { Receipt } from '../receipts/receipt.entity';
import { assertEditable } from '../receipts/receipts.service';
import { suggestForLines, takesAssignment } from './suggestions.service';

export async function acceptSuggestions(em: EntityManager, receipt: Receipt, user: User, role: string, lineIds?: string[]): Promise<void> {
  assertEditable(receipt, role);
  const lines = await em.find(ReceiptLine, { receipt }, { populate: ['part', 'system'], orderBy: { position: 'asc' } });
  let chosen: ReceiptLine[];
  if (lineIds) {
    const named = new Set(lineIds);
    chosen = lines.filter((line) => named.has(line.id));
    if (chosen.length !== named.size) throw new NotFound('Some of those lines');
  } else {
    chosen = lines.filter((line) => !line.system);
  }
  chosen = chosen.filter(takesAssignment);
  const suggestions = await suggestForLines(em, receipt.build, receipt.vendor?.id ?? null, chosen);
  for (const line of chosen) {
    const top = suggestions.get(line.id)?.[0];
    if (!top || top.score < ACCEPT_ALL_THRESHOLD) continue;
    const assignment = top.partId ? { partId: top.partId } : { partId: null, systemId: top.systemId };
    await updateLine(em, receipt, line.id, user, role, { version: line.version, ...assignment });
  }
}
