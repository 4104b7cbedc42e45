import { DRILL_CAUTION, DRILL_MARKING } from '#shared/utils/drill'
import type { User } from '#shared/types/db'
import { fileStem } from '../exports'
import { membersByIds } from '../feedback'
import { reportPdf } from './cards'

/**
 * E-mails the after-action report to chosen members, the PDF attached (rendered once), one message
 * per recipient so that addresses are not shared. Recipients must be members of the exercise (400).
 */
export async function sendReport(exerciseId: string, input: { userIds: string[]; message: string }, sender: User) {
  const to = membersByIds(exerciseId, input.userIds)
  const { data, pdf } = await reportPdf(exerciseId)
  const filename = `${fileStem(data.exercise.title)}-after-action-report.pdf`
  for (const m of to) {
    await sendMail({
      to: m.email,
      subject: `[${DRILL_MARKING}] After-action report: ${data.exercise.title}`,
      text: [
        DRILL_MARKING, '',
        `Hello ${m.name},`, '',
        `${sender.name} sends you the after-action report of "${data.exercise.title}" (attached as PDF).`,
        ...(input.message ? ['', input.message] : []),
        '', `The review desk: ${appLink(`/exercises/${exerciseId}/review`)}`, '',
        DRILL_CAUTION, '', DRILL_MARKING,
      ].join('\n'),
      attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
    })
  }
  audit(sender.id, 'review.report.send', exerciseId, { recipients: to.map(m => m.userId), bytes: pdf.length })
  return { sent: to.length, filename, bytes: pdf.length }
}
