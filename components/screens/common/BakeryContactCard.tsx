import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { ErrorState, LoadingState } from "../../ui/States";
import { useBakeryQuery } from "../../api/bakery";

/** The bakery's own contact details, for anyone signed in. */
export function BakeryContactCard({ title = "Your bakery" }: { title?: string }) {
  const bakery = useBakeryQuery();
  return (
    <Card title={title} testID="bakery-card">
      {bakery.isPending ? (
        <LoadingState label="Loading the bakery's details…" />
      ) : bakery.isError ? (
        <ErrorState error={bakery.error} onRetry={() => bakery.refetch()} retrying={bakery.isFetching} testID="bakery-error" />
      ) : (
        <DetailList
          items={[
            { label: "Bakery", value: bakery.data.name, testID: "bakery-name" },
            { label: "Phone", value: bakery.data.phone, testID: "bakery-phone" },
            { label: "E-mail", value: bakery.data.email, testID: "bakery-email" },
            { label: "Address", value: bakery.data.address },
          ]}
        />
      )}
    </Card>
  );
}
