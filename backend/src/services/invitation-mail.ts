import type { CampaignRole } from '../contracts/campaigns';
import type { OutgoingMail } from '../mail/mailer';

const roleDuties: Record<CampaignRole, string> = {
  lead: 'As a lead you upload spectra, assign readers, settle disagreements and release the confirmed redshifts.',
  reader: 'As a reader you inspect the spectra assigned to you and record a redshift, grade and class for each.',
  observer: 'As an observer you can see the confirmed redshifts and the spectra.',
};

export function invitationMail(p: {
  to: string;
  inviter: string;
  campaign: string;
  role: CampaignRole;
  link: string;
  expiresAt: string;
}): OutgoingMail {
  const expires = new Date(p.expiresAt).toUTCString();
  return {
    to: p.to,
    subject: `Invitation to join ${p.campaign} on Redward`,
    text: [
      `${p.inviter} invites you to join the campaign "${p.campaign}" on Redward as a ${p.role}.`,
      '',
      roleDuties[p.role],
      '',
      'Open this link to accept:',
      p.link,
      '',
      `The link works once and expires on ${expires}.`,
      'If you did not expect this message you can ignore it.',
    ].join('\n'),
  };
}
