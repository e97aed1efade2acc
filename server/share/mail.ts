/** The wording of a sizing sheet sent by e-mail: plain text first, a simple HTML twin beside it. */
import { CAUTION_TEXT } from '@/lib/caution';
import type { OutgoingMail } from '@/server/mail/send';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export interface SheetMailInput {
  to: string;
  senderName: string;
  teamName: string;
  sheet: { circuitTag: string; title: string; projectName: string; revision: number; statusLabel: string };
  message: string;
  link: string;
  expiresAt: Date;
  pdf?: { fileName: string; content: Buffer };
}

export function sheetMail(input: SheetMailInput): OutgoingMail {
  const until = input.expiresAt.toISOString().replace('T', ' ').slice(0, 16);
  const what = `${input.sheet.circuitTag} — ${input.sheet.title} (${input.sheet.projectName}, revision ${input.sheet.revision}, ${input.sheet.statusLabel.toLowerCase()})`;
  const lines = [
    `${input.senderName} of ${input.teamName} shares the sizing sheet ${what} with you on Ampwarden.`,
    `The link below shows it read-only, without signing in, until ${until} UTC${input.pdf ? '; the PDF sizing sheet is attached' : ''}.`,
  ];
  const caution = `Caution. ${CAUTION_TEXT.join(' ')}`;
  const note = input.message.trim();
  const text = [lines[0], note ? `Message from ${input.senderName}:\n${note}` : null, lines[1], input.link, caution].filter(Boolean).join('\n\n') + '\n';
  const html =
    `<div style="font-family:sans-serif;color:#1a2431">` +
    `<p>${escapeHtml(lines[0])}</p>` +
    (note ? `<blockquote style="border-left:3px solid #b8703d;margin:0;padding-left:8px">${escapeHtml(note).replace(/\n/g, '<br>')}</blockquote>` : '') +
    `<p>${escapeHtml(lines[1])}</p>` +
    `<p><a href="${escapeHtml(input.link)}" style="color:#9a5a2e">Open the sizing sheet</a></p>` +
    `<p style="font-size:12px;color:#4f6278">${escapeHtml(caution)}</p></div>`;
  return {
    to: input.to,
    subject: `Sizing sheet ${input.sheet.circuitTag}: ${input.sheet.title}`,
    text,
    html,
    attachments: input.pdf ? [{ filename: input.pdf.fileName, content: input.pdf.content, contentType: 'application/pdf' }] : undefined,
  };
}
