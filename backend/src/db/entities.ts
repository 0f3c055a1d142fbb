// The explicit list of entity schemas (no folder discovery: tsx and esbuild emit no decorator metadata).
import { PasswordResetSchema } from '../auth/password-reset.entity';
import { PendingSignUpSchema } from '../auth/pending-sign-up.entity';
import { UserSchema } from '../auth/user.entity';
import { BuildSchema } from '../builds/build.entity';
import { MembershipSchema } from '../builds/membership.entity';
import { InviteSchema } from '../crew/invite.entity';
import { PartSchema } from '../parts/part.entity';
import { VehicleSystemSchema } from '../systems/vehicle-system.entity';
import { AuditEventSchema } from '../audit/audit-event.entity';
import { CoreSchema } from '../receipts/core.entity';
import { ReceiptLineSchema } from '../receipts/receipt-line.entity';
import { ReceiptSchema } from '../receipts/receipt.entity';
import { UploadKeySchema } from '../receipts/upload-key.entity';
import { VendorSchema } from '../receipts/vendor.entity';
import { NotDuplicateSchema } from '../receipts/not-duplicate.entity';
import { CommentSchema } from '../review/comment.entity';
import { AlertPreferenceSchema } from '../alerts/alert-preference.entity';
import { AlertSentSchema } from '../alerts/alert-sent.entity';
import { MailRefusalSchema } from '../inbox/mail-refusal.entity';
import { MailedMessageSchema } from '../inbox/mailed-message.entity';
import { RetiredInboxTokenSchema } from '../inbox/retired-inbox-token.entity';

export const entities = [UserSchema, PasswordResetSchema, PendingSignUpSchema, BuildSchema, MembershipSchema, InviteSchema, VehicleSystemSchema, PartSchema, VendorSchema, ReceiptSchema, ReceiptLineSchema, CoreSchema, NotDuplicateSchema, AuditEventSchema, CommentSchema, AlertPreferenceSchema, AlertSentSchema, UploadKeySchema, RetiredInboxTokenSchema, MailRefusalSchema, MailedMessageSchema];
