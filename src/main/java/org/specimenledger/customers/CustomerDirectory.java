package org.specimenledger.customers;

import org.springframework.data.domain.Sort;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/** What other features may ask of customers and orders, by identifier, without the visibility rules of the API. */
@Component
public class CustomerDirectory {

    private final CustomerRepository customers;
    private final CustomerOrderRepository orders;

    CustomerDirectory(CustomerRepository customers, CustomerOrderRepository orders) {
        this.customers = customers;
        this.orders = orders;
    }

    @Transactional(readOnly = true)
    public boolean customerExists(UUID id) {
        return id != null && customers.existsById(id);
    }

    @Transactional(readOnly = true)
    public Optional<CustomerView> customer(UUID id) {
        return id == null ? Optional.empty() : customers.findById(id).map(CustomerView::of);
    }

    @Transactional(readOnly = true)
    public Optional<OrderView> order(UUID id) {
        return id == null ? Optional.empty() : orders.findById(id).map(OrderView::of);
    }

    /** Every order, oldest first, for the laboratory's pick lists (no customer scope). */
    @Transactional(readOnly = true)
    public List<OrderView> allOrders() {
        return orders.findAll(Sort.by("createdAt")).stream().map(OrderView::of).toList();
    }
}
