// The people of a deal as tests make them: a buyer, a shop, and who follows whose account.
import { Organisation, type User } from "~/models/index.server";
import { makeMember, makeOperatorUser } from "./factories";

/** An account manager who follows the buyer's account (its organisation is assigned to them). */
export async function makeManagerOf(buyer: User) {
  const manager = await makeOperatorUser("account_manager");
  await Organisation.update({ accountManagerId: manager.id }, { where: { id: buyer.organisationId } });
  return manager;
}

/** A buyer and an approved shop, each of its own new organisation: named as the test shows them, or at random. */
export async function makeBuyerAndShop(names: { buyer?: string; shop?: string } = {}) {
  const buyer = await makeMember("buyer", { organisationName: names.buyer });
  const shop = await makeMember("shop", { organisationName: names.shop });
  return { buyer, shop };
}

/** The people of a deal: a buyer, an approved shop, and the account manager who follows the buyer's account. */
export async function makeDealParties(names: { buyer?: string; shop?: string } = {}) {
  const { buyer, shop } = await makeBuyerAndShop(names);
  return { buyer, shop, manager: await makeManagerOf(buyer) };
}
