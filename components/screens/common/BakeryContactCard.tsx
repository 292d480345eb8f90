import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { QueryStates } from "../../ui/QueryStates";
import { useBakeryQuery } from "../../api/bakery";
import { ContactLink } from "../../ui/ContactLink";

/** The bakery's own contact details, for anyone signed in. */
export function BakeryContactCard({ title = "Your bakery" }: { title?: string }) {
  const bakery = useBakeryQuery();
  return (
    <Card title={title} testID="bakery-card">
      <QueryStates query={bakery} loadingLabel="Loading the bakery's details…" errorTestID="bakery-error">
        {(b) => (
          <DetailList
            items={[
              { label: "Bakery", value: b.name, testID: "bakery-name" },
              { label: "Phone", value: <ContactLink kind="phone" value={b.phone} testID="bakery-phone" /> },
              { label: "E-mail", value: <ContactLink kind="email" value={b.email} testID="bakery-email" /> },
              { label: "Address", value: b.address },
            ]}
          />
        )}
      </QueryStates>
    </Card>
  );
}
