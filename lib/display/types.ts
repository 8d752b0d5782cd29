export interface DisplayLinkDto {
  id: string;
  name: string;
  createdAt: string;
  revokedAt: string | null;
}
