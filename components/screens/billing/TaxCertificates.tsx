import React, { useMemo, useRef, useState } from "react";
import { z } from "zod";
import { Platform, StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { DateField } from "../../ui/DateField";
import { Badge, type BadgeTone } from "../../ui/Badge";
import { FormError, Notice } from "../../ui/FormError";
import { ProgressBar } from "../../ui/ProgressBar";
import { FieldFrame } from "../../ui/Field";
import { HiddenFileInput } from "../../ui/HiddenFileInput";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { downloadCertificate, useCertificatesQuery, useReviewCertificateMutation, useUploadCertificateMutation, type TaxCertificateDto } from "../../api/accountBilling";
import { useBakeryQuery, useBakeryTimeZone } from "../../api/bakery";
import { formatDate } from "../../format";
import { cleanDate } from "../../ordering/dates";
import { useZodForm } from "../../forms/useZodForm";
import { useDownload } from "../../forms/useDownload";
import { readText } from "../../forms/textSchemas";
import { billingStyles, day } from "./parts";
import { colors, radii, space } from "../../theme";

export const CERT_MAX_BYTES = 10 * 1024 * 1024;
const CERT_TYPES = ["application/pdf", "image/jpeg", "image/png"];
const STATUS_LABEL: Record<TaxCertificateDto["status"], string> = { pending: "Waiting for review", approved: "Approved", rejected: "Not accepted" };
const STATUS_TONE: Record<TaxCertificateDto["status"], BadgeTone> = { pending: "amber", approved: "sage", rejected: "danger" };

/** The approved certificate in force, if any; and whether the newest approved one has run out. */
export function exemptionState(certs: TaxCertificateDto[]): { valid: TaxCertificateDto | null; lapsed: TaxCertificateDto | null } {
  const approved = certs.filter((c) => c.status === "approved");
  const valid = approved.find((c) => !c.expired) ?? null;
  const lapsed = valid ? null : approved.find((c) => c.expired) ?? null;
  return { valid, lapsed };
}

export interface TaxCertificatesCardProps {
  accountId: number;
  /** Buyer (own account) and owner upload; the owner approves or rejects. */
  canUpload: boolean;
  canReview: boolean;
  /** Wording for the café ("your") or the office ("this account's"). */
  audience: "buyer" | "office";
}

/** Resale / tax-exemption certificates: what is on file, its review, the expiry warning, and uploading a new one. */
export function TaxCertificatesCard({ accountId, canUpload, canReview, audience }: TaxCertificatesCardProps) {
  const certs = useCertificatesQuery(accountId);
  const review = useReviewCertificateMutation(accountId);
  const timeZone = useBakeryTimeZone();
  const file = useDownload();

  const body = (data: TaxCertificateDto[]) => {
    const { valid, lapsed } = exemptionState(data);
    return (
      <>
        {valid ? (
          <Notice message={`${audience === "buyer" ? "Your" : "This account's"} exemption is approved until ${day(valid.expiresOn)}: invoices are issued without sales tax.`} testID="cert-valid" />
        ) : lapsed ? (
          <FormError message={`${audience === "buyer" ? "Your" : "The"} tax-exemption certificate expired on ${day(lapsed.expiresOn)}: tax is charged again until a new one is approved.`} testID="cert-expired-warning" />
        ) : null}
        {data.length === 0 ? (
          <AppText color="muted" testID="certs-empty">
            {audience === "buyer" ? "No certificate on file. If your business buys for resale or is tax-exempt, upload its certificate and the bakery will review it." : "No certificate on file: sales tax is charged on this account's invoices."}
          </AppText>
        ) : (
          <View testID="certs-list">
            {data.map((c, i) => (
              <View key={c.id} style={[styles.row, i > 0 && styles.divider]} testID={`cert-${c.id}`}>
                <View style={billingStyles.cardTop}>
                  <Badge label={c.expired ? "Expired" : STATUS_LABEL[c.status]} tone={c.expired ? "danger" : STATUS_TONE[c.status]} testID={`cert-${c.id}-status`} />
                  <AppText variant="small" color="muted">{`Expires ${day(c.expiresOn)} · uploaded ${formatDate(c.createdAt, timeZone)}`}</AppText>
                </View>
                <View style={billingStyles.buttons}>
                  <Button
                    label="View file"
                    icon="eye"
                    small
                    variant="ghost"
                    onPress={() => void file.run(() => downloadCertificate(c))}
                    testID={`cert-${c.id}-file`}
                  />
                  {canReview && c.status === "pending" ? (
                    <>
                      <Button label="Approve" icon="check" small variant="accent" busy={review.isPending && review.variables?.id === c.id && review.variables.status === "approved"} onPress={() => review.mutate({ id: c.id, status: "approved" })} testID={`cert-${c.id}-approve`} />
                      <Button label="Reject" icon="x" small variant="secondary" busy={review.isPending && review.variables?.id === c.id && review.variables.status === "rejected"} onPress={() => review.mutate({ id: c.id, status: "rejected" })} testID={`cert-${c.id}-reject`} />
                    </>
                  ) : null}
                </View>
              </View>
            ))}
          </View>
        )}
        <FormError message={file.error} testID="cert-file-error" />
        <FormError message={review.isError ? messageOf(review.error) : null} testID="cert-review-error" />
      </>
    );
  };

  return (
    <Card title="Tax exemption" testID="tax-certificates">
      <QueryStates query={certs} testID="certs" loadingLabel="Loading certificates…" errorTitle="Certificates didn't load">
        {body}
      </QueryStates>
      {canUpload ? <CertificateUpload accountId={accountId} /> : null}
    </Card>
  );
}

interface UploadValues {
  file: File | null;
  expiresOn: string;
}

const NO_UPLOAD: UploadValues = { file: null, expiresOn: "" };

/** The upload checked before sending: a file, and an expiry date that has not passed in the bakery's today. */
export function certificateUploadSchema(today: string | undefined) {
  return z.object({
    file: z.custom<File>((f) => f != null, "Choose the certificate file."),
    expiresOn: readText<string>((text) => {
      const date = cleanDate(text);
      if (!date) return { message: "Write the expiry date as YYYY-MM-DD." };
      if (today && date < today) return { message: "That date has passed: upload a certificate that is still current." };
      return { value: date };
    }),
  });
}

/** Why a picked file is refused before upload, or null. */
export function certificateFileProblem(f: Pick<File, "type" | "size">): string | null {
  if (!CERT_TYPES.includes(f.type)) return "Upload the certificate as a PDF, JPEG or PNG.";
  if (f.size > CERT_MAX_BYTES) return "The certificate file is larger than 10 MB.";
  return null;
}

function CertificateUpload({ accountId }: { accountId: number }) {
  const upload = useUploadCertificateMutation(accountId);
  const today = useBakeryQuery().data?.today;
  const input = useRef<HTMLInputElement | null>(null);
  const schema = useMemo(() => certificateUploadSchema(today), [today]);
  const form = useZodForm({ schema, initial: NO_UPLOAD, manyMessage: null });
  const [done, setDone] = useState(false);
  const file = form.values.file;

  const pick = (f: File | undefined) => {
    setDone(false);
    const problem = f ? certificateFileProblem(f) : null;
    form.setErrors(({ file: _old, ...others }) => (problem ? { ...others, file: problem } : others));
    if (f && !problem) form.setValue("file", f);
  };

  const submit = () => {
    setDone(false);
    void form.submit(async (checked) => {
      await upload.mutateAsync(checked);
      setDone(true);
      form.reset(NO_UPLOAD);
    });
  };

  if (Platform.OS !== "web") {
    return (
      <AppText variant="small" color="muted">
        Upload certificates from the web app on a computer.
      </AppText>
    );
  }
  return (
    <View style={styles.upload} testID="cert-upload">
      <FieldFrame
        label="Upload a certificate"
        hint="PDF, JPEG or PNG, up to 10 MB. The bakery reviews it; once approved, new invoices carry no sales tax until it expires."
        error={form.errors.file}
        testID="cert-choose"
      >
        {done ? <Notice message="Certificate uploaded. The bakery will review it." testID="cert-uploaded" /> : null}
        <FormError message={form.formError} testID="cert-upload-error" />
        <HiddenFileInput ref={input} accept={CERT_TYPES.join(",")} onPick={pick} label="Certificate file" testID="cert-input" />
        <View style={billingStyles.buttons}>
          <Button label={file ? "Choose another file" : "Choose file"} icon="paperclip" variant="secondary" onPress={() => input.current?.click()} testID="cert-choose" />
          {file ? (
            <AppText variant="small" testID="cert-file-name" style={styles.fileName} numberOfLines={1}>
              {file.name}
            </AppText>
          ) : null}
        </View>
      </FieldFrame>
      <DateField label="Expires on" {...form.text("expiresOn")} testID="cert-expires" />
      {upload.isPending ? <ProgressBar value={upload.progress} label="Uploading the certificate" testID="cert-progress" /> : null}
      <Button label="Upload certificate" icon="upload" busy={form.submitting} onPress={submit} testID="cert-submit" />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.xs, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  upload: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.page, borderWidth: 1, borderColor: colors.border },
  fileName: { flexShrink: 1, maxWidth: 240 },
});
