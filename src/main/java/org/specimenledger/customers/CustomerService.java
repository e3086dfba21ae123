package org.specimenledger.customers;

import java.time.Clock;
import java.util.List;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Registers and changes customers and orders; each write is one ledger event in the same transaction. */
@Service
public class CustomerService {

    private final CustomerRepository customers;
    private final CustomerOrderRepository orders;
    private final Ledger ledger;
    private final Clock clock;

    CustomerService(CustomerRepository customers, CustomerOrderRepository orders, Ledger ledger, Clock clock) {
        this.customers = customers;
        this.orders = orders;
        this.ledger = ledger;
        this.clock = clock;
    }

    @Transactional
    public CustomerView register(CustomerRequests.CustomerRequest request) {
        String name = request.name().trim();
        if (customers.existsByNameIgnoreCase(name)) {
            throw new DuplicateRecord("/name", "a customer named '" + name + "' already exists");
        }
        Customer customer = customers.saveAndFlush(new Customer(name, request.address().trim(), clock.instant()));
        CustomerView view = CustomerView.of(customer);
        ledger.record("customer.registered", "customer", customer.id(), request.reason(), null, view);
        return view;
    }

    @Transactional
    CustomerView change(UUID id, CustomerRequests.CustomerRequest request) {
        String reason = ChangeReason.required(request.reason());
        Customer customer = customers.findById(id).orElseThrow(() -> new RecordNotFound("customer", id));
        String name = request.name().trim();
        if (customers.existsByNameIgnoreCaseAndIdNot(name, id)) {
            throw new DuplicateRecord("/name", "a customer named '" + name + "' already exists");
        }
        CustomerView before = CustomerView.of(customer);
        customer.rename(name, request.address().trim());
        customers.saveAndFlush(customer);
        CustomerView after = CustomerView.of(customer);
        ledger.record("customer.changed", "customer", id, reason, before, after);
        return after;
    }

    @Transactional(readOnly = true)
    List<CustomerView> list() {
        return CurrentUser.customerOrganisation()
                .map(org -> customers.findById(org).map(CustomerView::of).stream().toList())
                .orElseGet(() -> customers.findAllByOrderByNameAsc().stream().map(CustomerView::of).toList());
    }

    @Transactional(readOnly = true)
    CustomerView get(UUID id) {
        return CustomerView.of(visibleCustomer(id));
    }

    @Transactional
    public OrderView placeOrder(UUID customerId, CustomerRequests.OrderRequest request) {
        Customer customer = customers.findById(customerId)
                .orElseThrow(() -> new RecordNotFound("customer", customerId));
        List<Requirement> requirements = RequirementRules.checked(request.requirements());
        String po = request.purchaseOrder().trim();
        if (orders.existsByCustomerIdAndPurchaseOrder(customer.id(), po)) {
            throw new DuplicateRecord("/purchaseOrder", "customer '" + customer.name()
                    + "' already has an order with purchase order '" + po + "'");
        }
        CustomerOrder order = orders.saveAndFlush(new CustomerOrder(customer.id(), po,
                request.materialSpecification().trim(), request.receivedOn(), requirements,
                request.reportingUnitsOrDefault(), clock.instant()));
        OrderView view = OrderView.of(order);
        ledger.record("order.registered", "order", order.id(), request.reason(), null, view);
        return view;
    }

    @Transactional
    OrderView reviseOrder(UUID id, CustomerRequests.OrderRequest request) {
        String reason = ChangeReason.required(request.reason());
        CustomerOrder order = orders.findById(id).orElseThrow(() -> new RecordNotFound("order", id));
        List<Requirement> requirements = RequirementRules.checked(request.requirements());
        String po = request.purchaseOrder().trim();
        if (!po.equals(order.purchaseOrder()) && orders.existsByCustomerIdAndPurchaseOrder(order.customerId(), po)) {
            throw new DuplicateRecord("/purchaseOrder", "this customer already has an order with purchase order '"
                    + po + "'");
        }
        OrderView before = OrderView.of(order);
        order.revise(po, request.materialSpecification().trim(), request.receivedOn(), requirements,
                request.reportingUnitsOrDefault());
        orders.saveAndFlush(order);
        OrderView after = OrderView.of(order);
        ledger.record("order.revised", "order", id, reason, before, after);
        return after;
    }

    @Transactional(readOnly = true)
    List<OrderView> orders(UUID customerId) {
        UUID scope = CurrentUser.customerOrganisation().orElse(null);
        if (customerId != null) {
            visibleCustomer(customerId);
            return orders.findAllByCustomerIdOrderByCreatedAtAsc(customerId).stream().map(OrderView::of).toList();
        }
        List<CustomerOrder> found = scope != null ? orders.findAllByCustomerIdOrderByCreatedAtAsc(scope)
                : orders.findAllByOrderByCreatedAtAsc();
        return found.stream().map(OrderView::of).toList();
    }

    @Transactional(readOnly = true)
    OrderView order(UUID id) {
        CustomerOrder order = orders.findById(id)
                .filter(o -> CurrentUser.customerOrganisation().map(org -> org.equals(o.customerId())).orElse(true))
                .orElseThrow(() -> new RecordNotFound("order", id));
        return OrderView.of(order);
    }

    /** A customer may see only their own organisation: any other id is "not found", not "forbidden". */
    private Customer visibleCustomer(UUID id) {
        return customers.findById(id)
                .filter(c -> CurrentUser.customerOrganisation().map(org -> org.equals(c.id())).orElse(true))
                .orElseThrow(() -> new RecordNotFound("customer", id));
    }
}
