import { DataTypes, Model, type Sequelize } from 'sequelize';

export const MAIL_STATUSES = ['queued', 'sent', 'failed'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

export type MailAttachment = { filename: string; contentType: string; contentBase64: string };

/** The outbox: every message is stored before it is sent and retried until it goes. */
export class OutgoingMail extends Model {
  declare id: string;
  declare organisationId: string | null;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare attachments: MailAttachment[];
  declare status: MailStatus;
  declare attempts: number;
  declare lastError: string | null;
  declare nextAttemptAt: Date;
  declare sentAt: Date | null;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    OutgoingMail.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: false },
        attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        status: { type: DataTypes.ENUM(...MAIL_STATUSES), allowNull: false, defaultValue: 'queued' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        sentAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'outgoing_mail', underscored: true },
    );
  }
}
