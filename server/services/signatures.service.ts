// Electronic signatures. The signer has re-entered their password (checked by
// the event service); the signature keeps the printed name, the role signed in,
// the meaning, the UTC time and the SHA-256 of the record's canonical content
// (RFC 8785 JSON) as it stood when signed, so a later change to what was signed
// is detectable by recomputing the hash.
import type { Transaction } from 'sequelize';
import { Signature } from '../models';
import type { SignatureView } from '../../shared/schemas/workflow';
import { contentHash } from '../lib/content-hash';

export async function recordSignature(
  transaction: Transaction,
  input: {
    recordType: Signature['recordType'];
    recordId: number;
    event: string;
    signer: { id: number; displayName: string };
    role: string;
    meaning: string;
    signedAt: Date;
    content: unknown;
  },
): Promise<Signature> {
  return Signature.create(
    {
      recordType: input.recordType,
      recordId: input.recordId,
      event: input.event,
      signerId: input.signer.id,
      printedName: input.signer.displayName,
      role: input.role,
      meaning: input.meaning,
      signedAt: new Date(Math.floor(input.signedAt.getTime())),
      contentHash: contentHash(input.content),
    },
    { transaction },
  );
}

export function presentSignature(signature: Signature): SignatureView {
  return {
    id: signature.id,
    event: signature.event,
    signerId: signature.signerId,
    printedName: signature.printedName,
    role: signature.role,
    meaning: signature.meaning,
    signedAt: signature.signedAt.toISOString(),
    contentHash: signature.contentHash,
  };
}
