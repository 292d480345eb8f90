import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkButton } from "../../ui/LinkButton";
import { Badge } from "../../ui/Badge";
import { Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { ListCard, ListCardText, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { usePriceListsQuery } from "../../api/priceLists";
import { describePriceList, usedBy } from "./priceListForm";

/** The owner's price lists: a percentage off, or fixed prices per product. Accounts choose one on their page. */
export function PriceListsScreen({ notice }: { notice?: string }) {
  const lists = usePriceListsQuery();
  const router = useRouter();
  return (
    <Screen testID="price-lists-screen">
      <PageHeader
        title="Price lists"
        subtitle="Give some accounts their own prices. Pick an account's list on its page, under Delivery and prices."
        actions={<LinkButton href="/office/price-lists/new" label="New price list" icon="plus" testID="new-price-list" />}
        testID="price-lists-title"
      />
      {notice ? <Notice message={notice} testID="price-lists-notice" /> : null}
      <QueryStates
        query={lists}
        testID="price-lists"
        loadingTestID="loading"
        loadingLabel="Loading price lists…"
        errorTitle="Price lists didn't load"
        empty={{ icon: "tag", title: "No price lists yet", message: "Every account pays list prices until you make one.", action: <LinkButton href="/office/price-lists/new" label="New price list" icon="plus" /> }}
      >
        {(data) => (
          <ListCards testID="price-lists-list">
            {data.map((l) => (
              <ListCard
                key={l.id}
                onPress={() => router.push(`/office/price-lists/${l.id}`)}
                accessibilityLabel={`${l.name}, ${describePriceList(l)}`}
                testID={`price-list-${l.id}`}
              >
                <ListCardText>
                  <AppText variant="bodyStrong">{l.name}</AppText>
                  <AppText variant="small" color="muted">
                    {describePriceList(l)}
                  </AppText>
                  <Badge label={usedBy(l.accountCount)} tone={l.accountCount ? "crust" : "neutral"} />
                  {l.accounts?.length ? (
                    <AppText variant="small" color="muted" testID={`price-list-${l.id}-accounts`}>
                      {l.accounts.map((a) => a.businessName).join(", ")}
                    </AppText>
                  ) : null}
                </ListCardText>
              </ListCard>
            ))}
          </ListCards>
        )}
      </QueryStates>
    </Screen>
  );
}
