import type { OutgoingMessage } from '../mail/mailer';
import type { Role } from '../../shared/vocabularies';

const roleWords: Record<Role, string> = {
  admin: 'site admin (accounts, suppliers and roles)',
  'supplier-admin': 'supplier admin (your own curve tables)',
  designer: 'designer (systems, selections and projects)',
  integrator: 'integrator (the API with your own tokens)',
};

function hours(ms: number): string {
  const value = Math.round(ms / 3600_000);
  return value >= 48 ? `${Math.round(value / 24)} days` : value === 1 ? '1 hour' : `${value} hours`;
}

export function invitationMessage(options: {
  to: string;
  role: Role;
  link: string;
  validForMs: number;
  invitedBy: string;
}): OutgoingMessage {
  return {
    to: options.to,
    subject: 'You are invited to Riffle',
    text: [
      `${options.invitedBy} invites you to Riffle as a ${roleWords[options.role]}.`,
      '',
      'Open this link to choose your name and password:',
      options.link,
      '',
      `The link works once, within ${hours(options.validForMs)}. If you did not expect this message, ignore it.`,
    ].join('\n'),
  };
}

export function passwordResetMessage(options: { to: string; link: string; validForMs: number }): OutgoingMessage {
  return {
    to: options.to,
    subject: 'Reset your Riffle password',
    text: [
      'Someone (we hope you) asked to reset the password of your Riffle account.',
      '',
      'Open this link to choose a new password:',
      options.link,
      '',
      `The link works once, within ${hours(options.validForMs)}. If you did not ask, ignore this message: your password stays as it is.`,
    ].join('\n'),
  };
}
