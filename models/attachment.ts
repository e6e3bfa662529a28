import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import { datetime, enumOf, modelOptions, ref, str, uuidId } from "./columns";
import { ATTACHMENT_OWNER_TYPES, type AttachmentOwnerType } from "@/lib/schemas/enums";
import type { User } from "./user";

/**
 * A stored photo or file. The id is the server's; clientId is the device's own id for the file,
 * unique within the shop, so an offline upload can be resent; ownerId is a job id, reading UUID or instrument id
 * as text, depending on ownerType.
 */
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: string;
  declare shopId: number;
  declare clientId: string;
  declare ownerType: AttachmentOwnerType;
  declare ownerId: string;
  declare objectKey: string;
  declare thumbKey: CreationOptional<string | null>;
  declare contentType: string;
  declare sizeBytes: number;
  declare originalName: string;
  declare uploadedBy: number;
  declare createdAt: CreationOptional<Date>;

  declare uploader?: NonAttribute<User>;
}

export function initAttachment(sequelize: Sequelize): void {
  Attachment.init(
    {
      id: uuidId(),
      shopId: ref(),
      clientId: { type: DataTypes.CHAR(36), allowNull: false },
      ownerType: enumOf(ATTACHMENT_OWNER_TYPES),
      ownerId: str(36),
      objectKey: str(255),
      thumbKey: str(255, true),
      contentType: str(100),
      sizeBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      originalName: str(255),
      uploadedBy: ref(),
      createdAt: datetime(false),
    },
    modelOptions(sequelize, "attachments", "created"),
  );
}
