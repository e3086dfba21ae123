package org.specimenledger.customers;

import java.util.List;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;

interface CustomerOrderRepository extends JpaRepository<CustomerOrder, UUID> {

    boolean existsByCustomerIdAndPurchaseOrder(UUID customerId, String purchaseOrder);

    List<CustomerOrder> findAllByCustomerIdOrderByCreatedAtAsc(UUID customerId);

    List<CustomerOrder> findAllByOrderByCreatedAtAsc();
}
