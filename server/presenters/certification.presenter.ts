import type { Certification } from '../models';
import type { CertificationView } from '../../shared/schemas/certification';
import { certificateFlag, visionFlag } from '../../shared/registers/flags';

export function presentCertification(certification: Certification, now: Date, visionMonths: number): CertificationView {
  return {
    id: certification.id,
    userId: certification.userId,
    personName: certification.person?.displayName ?? '',
    personEmail: certification.person?.email ?? '',
    method: certification.method,
    level: certification.level as 1 | 2 | 3,
    scheme: certification.scheme,
    certificateNumber: certification.certificateNumber,
    issuedOn: certification.issuedOn,
    expiresOn: certification.expiresOn,
    nearVisionExamOn: certification.nearVisionExamOn,
    colourVisionCheckedOn: certification.colourVisionCheckedOn,
    sectors: certification.sectors ? certification.sectors.split(',') : [],
    notes: certification.notes,
    active: certification.active,
    version: certification.version,
    certificate: certificateFlag(certification.expiresOn, now),
    vision: visionFlag(certification.nearVisionExamOn, now, visionMonths),
  };
}
